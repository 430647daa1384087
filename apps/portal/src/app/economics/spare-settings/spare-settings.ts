import { ChangeDetectionStrategy, Component, computed, inject, output, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatExpansionModule } from '@angular/material/expansion';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { SpareSettingsSchema, SpareSettingsView } from '@cc/shared';
import { describeFailure } from '../../core/http/api-error-of';
import { Notice } from '../../core/http/notice';
import { EconomicsApi } from '../economics-api';

/** The organisation's spare allowance: extra units of an entry's materials loaded on a day that uses the entry. */
@Component({
  selector: 'cc-spare-settings',
  imports: [MatButtonModule, MatExpansionModule, MatFormFieldModule, MatInputModule],
  templateUrl: './spare-settings.html',
  styleUrl: './spare-settings.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SpareSettings {
  private readonly api = inject(EconomicsApi);
  private readonly notice = inject(Notice);

  /** After a save: the pick list changes with it. */
  readonly saved = output<void>();

  protected readonly view = signal<SpareSettingsView | null>(null);
  protected readonly values = signal<Record<string, number>>({});
  protected readonly errors = signal<Record<string, string>>({});
  protected readonly formError = signal<string | null>(null);
  protected readonly isBusy = signal(false);
  protected readonly entries = computed(() => (this.view()?.entries ?? []).filter((e) => e.hasMaterials));

  protected open(): void {
    if (this.view()) return;
    this.api.spares().subscribe({
      next: (v) => this.show(v),
      error: (err: unknown) => this.notice.failure(err),
    });
  }

  private show(v: SpareSettingsView): void {
    this.view.set(v);
    this.values.set(Object.fromEntries(v.entries.map((e) => [e.entryKey, e.spareUnits])));
  }

  protected set(entryKey: string, raw: string): void {
    const value = raw.trim() === '' ? 0 : Number(raw);
    this.values.update((all) => ({ ...all, [entryKey]: value }));
  }

  protected save(): void {
    this.formError.set(null);
    const spares = Object.entries(this.values()).map(([entryKey, spareUnits]) => ({ entryKey, spareUnits }));
    const parsed = SpareSettingsSchema.safeParse({ spares });
    if (!parsed.success) {
      const byKey: Record<string, string> = {};
      for (const issue of parsed.error.issues) {
        const index = issue.path[1];
        if (typeof index === 'number') byKey[spares[index].entryKey] = issue.message;
      }
      this.errors.set(byKey);
      this.formError.set('Some spare counts need attention.');
      return;
    }
    this.errors.set({});
    this.isBusy.set(true);
    this.api.saveSpares(parsed.data).subscribe({
      next: (v) => {
        this.isBusy.set(false);
        this.show(v);
        this.notice.success('Spare allowance saved.');
        this.saved.emit();
      },
      error: (err: unknown) => {
        this.isBusy.set(false);
        this.formError.set(describeFailure(err));
      },
    });
  }
}
