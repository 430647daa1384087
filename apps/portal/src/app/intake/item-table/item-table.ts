import { ChangeDetectionStrategy, Component, input, output } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatIconModule } from '@angular/material/icon';
import { MatTableModule } from '@angular/material/table';
import { MatTooltipModule } from '@angular/material/tooltip';
import { codeReferenceText, Confidence, FINDING_CODE_TABLE, LineItem, locationText } from '@cc/shared';
import { EditionNote } from '../../ui/edition-note/edition-note';
import { ROOM_LABELS } from '../room-labels';
import { SEVERITY_LABELS } from '../severity-labels';

const CONFIDENCE_MARKS: Partial<Record<Confidence, { label: string; explanation: string; isLow: boolean }>> = {
  inferred: {
    label: 'Check: inferred',
    explanation: 'The room or the defect was inferred from context (a heading, an earlier sentence, a computation). Check it against the report.',
    isLow: true,
  },
  composed: {
    label: 'Check: device and condition',
    explanation: 'No phrase of the report names this defect: it was read from a device and a condition said of it in one clause. Check the wording.',
    isLow: true,
  },
  normalised: {
    label: 'Read from shorthand',
    explanation: 'Found after reading an abbreviation, a misspelling or a number word. Check the wording.',
    isLow: false,
  },
};

/** Whether an item rests on something less than a phrase of the report (marked "Check" and listed first). */
export function isLowConfidence(confidence: Confidence | null | undefined): boolean {
  return confidence ? (CONFIDENCE_MARKS[confidence]?.isLow ?? false) : false;
}

/** The proposed items under review, one row each, with their actions. */
@Component({
  selector: 'cc-item-table',
  imports: [MatTableModule, MatCheckboxModule, MatButtonModule, MatIconModule, MatTooltipModule, EditionNote],
  templateUrl: './item-table.html',
  styleUrl: './item-table.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ItemTable {
  readonly items = input.required<LineItem[]>();
  readonly activeItemId = input<number | null>(null);
  readonly selectedIds = input<ReadonlySet<number>>(new Set());
  /** Whether the row actions are offered (off while a change is on its way). */
  readonly isEditable = input(true);

  readonly activated = output<LineItem>();
  readonly selectionToggled = output<number>();
  readonly edit = output<LineItem>();
  readonly split = output<LineItem>();
  readonly remove = output<LineItem>();

  protected readonly where = locationText;
  protected readonly codeRefs = codeReferenceText;
  protected readonly columns = ['select', 'code', 'room', 'location', 'quantity', 'severity', 'evidence', 'actions'];

  protected codeLabel(item: LineItem): string {
    return FINDING_CODE_TABLE[item.code].label;
  }

  protected roomLabel(item: LineItem): string {
    return ROOM_LABELS[item.room];
  }

  /** A mark for items the reader is less sure of; nothing for an exact phrase or an item a person added. */
  protected confidenceMark(item: LineItem): { label: string; explanation: string; isLow: boolean } | null {
    return item.confidence ? (CONFIDENCE_MARKS[item.confidence] ?? null) : null;
  }

  protected severityLabel(item: LineItem): string {
    return SEVERITY_LABELS[item.severity];
  }
}
