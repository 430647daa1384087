// Invented report text and items for the intake component specs (not part of the app bundle).
import { editionNote, LineItem, ReportFile, UploadResult } from '@cc/shared';

export const REPORT_PAGES = [
  'ELECTRICAL\n1. Kitchen countertop receptacles are not GFCI protected (2 locations).\n2. Reversed polarity at the hall bedroom receptacle.',
  'ROOFING\nShingles are worn at the ridge.\n3. Open junction box in the garage ceiling.',
];
const JOINED = REPORT_PAGES.join('\f');

export function report(overrides: Partial<ReportFile> = {}): ReportFile {
  return {
    id: 5,
    kind: 'pdf',
    originalName: 'inspection-excerpt.pdf',
    sizeBytes: 4096,
    pageCount: REPORT_PAGES.length,
    sha256: 'ab'.repeat(32),
    pages: REPORT_PAGES,
    skipped: [{ section: 'ROOFING', sectionKind: 'non-electrical', reason: 'non-electrical-section', text: 'Shingles are worn at the ridge.', page: 2, start: JOINED.indexOf('Shingles'), end: JOINED.indexOf('ridge.') + 6 }],
    uploadedByName: 'Ada Agent',
    createdAt: '2026-04-02T09:00:00Z',
    ...overrides,
  };
}

/** An item whose evidence is the given sentence of the report. */
export function item(id: number, evidence: string, overrides: Partial<LineItem> = {}): LineItem {
  const start = JOINED.indexOf(evidence);
  if (start < 0) throw new Error(`not in the report: ${evidence}`);
  return {
    id,
    requestId: 12,
    code: 'receptacle-damaged',
    room: 'unknown',
    location: '',
    quantity: null,
    evidence,
    page: JOINED.slice(0, start).split('\f').length,
    reportFileId: 5,
    evidenceStart: start,
    evidenceEnd: start + evidence.length,
    severity: 'repair',
    necRefs: [],
    status: 'proposed',
    isEdited: false,
    version: 1,
    editionNote: null,
    ...overrides,
  };
}

export function proposedItems(): LineItem[] {
  return [
    item(31, 'Kitchen countertop receptacles are not GFCI protected (2 locations).', {
      code: 'gfci-missing',
      room: 'kitchen',
      location: 'kitchen countertop',
      quantity: 2,
      severity: 'safety',
      necRefs: ['210.8(A)', '406.4(D)(3)'],
      version: 3,
      editionNote: editionNote('gfci-missing', 'kitchen', { yearBuilt: 1978, necEdition: 2023 }),
    }),
    item(32, 'Reversed polarity at the hall bedroom receptacle.', { code: 'reversed-polarity', room: 'bedroom', location: 'hall bedroom receptacle', severity: 'safety', version: 1 }),
    item(33, 'Open junction box in the garage ceiling.', { code: 'open-junction-box', room: 'garage', location: 'garage ceiling', severity: 'safety', version: 2 }),
  ];
}

export function uploadResult(overrides: Partial<UploadResult> = {}): UploadResult {
  return { report: report(), isDuplicate: false, proposedCount: 3, skippedCount: 1, ...overrides };
}
