import { PICK_KIND_LABELS, PICK_KINDS, spareNote, WORK_SAFETY_CAUTION, type PickList } from '@cc/shared';
import { createPdfLayout, MARGIN, MUTED } from '../integrations/pdf/pdf-layout';

/** The pick list of a day (or one visit) on paper, visits in driving order, lines grouped by kind with their visits and a box to tick. */
export function renderPickListPdf(list: PickList, contractorName: string): Promise<Buffer> {
  const title = list.siteVisitId === null ? `Pick list for ${list.date}` : `Pick list for one visit on ${list.date}`;
  const { doc, heading, paragraph, row, pageNumbers, finish } = createPdfLayout({ info: { Title: title, Author: contractorName, Subject: `${title}, ${list.electrician.name}` }, footerHeight: 24 });
  doc.font('strong').fontSize(18).text(contractorName, MARGIN, MARGIN);
  doc.moveDown(0.5);
  doc.font('strong').fontSize(14).fillColor('black').text(title);
  paragraph(`${list.electrician.name} · ${list.visits.length} visit${list.visits.length === 1 ? '' : 's'}`, 10, MUTED);

  heading('Visits');
  for (const v of list.visits) row(`Site visit ${v.number} · ${v.street} (${v.reference})`, String(v.itemCount), v.itemCount === 1 ? 'item' : 'items');

  for (const kind of PICK_KINDS) {
    const lines = list.lines.filter((l) => l.kind === kind);
    if (!lines.length) continue;
    heading(PICK_KIND_LABELS[kind]);
    row('Material (for which visits)', 'Items', 'Load', 'strong');
    for (const l of lines) {
      const facts = [spareNote(l), l.isSiteCondition ? 'site condition' : '', l.forVisits.join('; ')].filter(Boolean).join(' · ');
      row(`${l.isTicked ? '[x]' : '[  ]'} ${l.name}${facts ? ` — ${facts}` : ''}`, String(l.quantity), String(l.total));
    }
  }
  if (!list.lines.length) paragraph('Nothing to load: no booked item on this list names materials.', 10, MUTED);
  if (list.itemsWithoutMaterials.length) {
    heading('Items without a materials list');
    for (const i of list.itemsWithoutMaterials) row(`Item ${i.itemId} (${i.code}): ${i.reason}`, '', '');
  }
  doc.moveDown(1);
  paragraph(WORK_SAFETY_CAUTION, 9, MUTED);
  pageNumbers(`${list.electrician.name} · ${list.date}`);
  return finish();
}
