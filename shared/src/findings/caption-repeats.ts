import type { Finding } from './finding.schema';

/**
 * A photo caption that names a defect the report describes elsewhere ("Photo E3: Double tap, pos. 8"
 * under the comment "Double taps: (2) at main panel ...") points at that finding; it is not another
 * defect (common practice: reports list their photos after, or beside, the text). A caption that is
 * the only place a defect is named still gives its finding.
 */
const CAPTION = /^\s*(?:photos?|pics?|pictures?|images?|figs?\.?|figures?)\s*(?:#\s*)?(?:[A-Z]{1,2}[-.]?)?\d{1,3}[a-z]?(?:\s*(?:[-–,&]|and|to)\s*(?:[A-Z]{1,2}[-.]?)?\d{1,3}[a-z]?)*\s*[:.)–-]/i;

/** Whether a finding's sentence is a caption: it, or its line from the line's start, opens with a photo number. */
export function isCaption(joined: string, f: Pick<Finding, 'start' | 'end'>): boolean {
  const lineStart = Math.max(joined.lastIndexOf('\n', f.start - 1), joined.lastIndexOf('\f', f.start - 1)) + 1;
  return CAPTION.test(joined.slice(f.start, f.end)) || CAPTION.test(joined.slice(lineStart, f.end));
}

/** The findings without captions that repeat a finding of the text (same code, same room or a caption with no room). */
export function dropCaptionRepeats(findings: readonly Finding[], joined: string): Finding[] {
  const caption = findings.map((f) => isCaption(joined, f));
  return findings.filter((f, i) => {
    if (!caption[i]) return true;
    return !findings.some((g, j) => j !== i && !caption[j] && g.code === f.code && (g.room === f.room || f.room === 'unknown'));
  });
}
