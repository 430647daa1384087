import { ChangeDetectionStrategy, Component, inject, input, output } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatIconModule } from '@angular/material/icon';
import { MatTableModule } from '@angular/material/table';
import { SiteAdderRecord } from '@cc/shared';
import { Notice } from '../../core/http/notice';
import { adderEffectLabel } from '../../pricing/adder-effect-label';
import { AdderFormData, AdderFormDialog } from '../adder-form-dialog/adder-form-dialog';
import { RateBookApi } from '../rate-book-api';

/** The site conditions ("adders") of the rate book and what each does to labour. */
@Component({
  selector: 'cc-adders-table',
  imports: [MatTableModule, MatButtonModule, MatIconModule],
  templateUrl: './adders-table.html',
  styleUrl: './adders-table.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AddersTable {
  private readonly api = inject(RateBookApi);
  private readonly dialog = inject(MatDialog);
  private readonly notice = inject(Notice);

  readonly adders = input.required<SiteAdderRecord[]>();
  readonly changed = output<void>();

  protected readonly columns = ['name', 'effect', 'builtBefore', 'actions'];
  protected readonly effectLabel = adderEffectLabel;

  protected openForm(adder: SiteAdderRecord | null): void {
    this.dialog
      .open<AdderFormDialog, AdderFormData, SiteAdderRecord>(AdderFormDialog, { data: { adder }, width: '640px', maxWidth: '96vw' })
      .afterClosed()
      .subscribe((saved) => {
        if (!saved) return;
        this.notice.success(`${saved.name} saved.`);
        this.changed.emit();
      });
  }

  protected remove(adder: SiteAdderRecord): void {
    if (!window.confirm(`Delete “${adder.name}”? Items that use it are priced without it.`)) return;
    this.api.deleteAdder(adder.id, adder.version).subscribe({
      next: () => {
        this.notice.success(`${adder.name} deleted.`);
        this.changed.emit();
      },
      error: (err: unknown) => this.notice.failure(err),
    });
  }
}
