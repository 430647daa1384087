import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { MatTableModule } from '@angular/material/table';
import { FINDING_CODE_TABLE, ITEM_STATUS_LABELS, LineItem, locationText } from '@cc/shared';
import { EditionNote } from '../../ui/edition-note/edition-note';
import { ROOM_LABELS } from '../room-labels';

/** The request's line items, read-only, as every party sees them once the review is done. */
@Component({
  selector: 'cc-line-item-list',
  imports: [MatTableModule, EditionNote],
  templateUrl: './line-item-list.html',
  styleUrl: './line-item-list.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class LineItemList {
  readonly items = input.required<LineItem[]>();

  protected readonly where = locationText;
  protected readonly columns = ['code', 'room', 'location', 'quantity', 'status'];

  protected codeLabel(item: LineItem): string {
    return FINDING_CODE_TABLE[item.code].label;
  }

  protected roomLabel(item: LineItem): string {
    return ROOM_LABELS[item.room];
  }

  protected statusLabel(item: LineItem): string {
    return ITEM_STATUS_LABELS[item.status];
  }
}
