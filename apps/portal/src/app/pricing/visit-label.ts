import { Pipe, PipeTransform } from '@angular/core';

/** How a visit key reads to people: `visit-2` → "Visit 2"; any other key as it is. */
export function visitLabel(key: string): string {
  const match = /^visit-(\d+)$/.exec(key);
  return match ? `Visit ${match[1]}` : key;
}

@Pipe({ name: 'visitLabel' })
export class VisitLabelPipe implements PipeTransform {
  transform(key: string): string {
    return visitLabel(key);
  }
}
