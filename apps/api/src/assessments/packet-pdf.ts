import {
  DEFAULT_DERMAL_ABSORPTION_PERCENT,
  formatMargin,
  MINIMUM_MARGIN_OF_SAFETY,
  PART_A_HEADINGS,
  PART_B_HEADINGS,
  type SafetyPacket,
} from '@batchproof/shared';
import { LABEL_FONT_FAMILY } from '../labels/pdf';
import {
  dataTable as table,
  type DocumentCell as Cell,
  utcMinute,
} from '../labels/pdf/document-blocks';

/**
 * The pdfmake definition of a safety-assessment packet: a title block, the ten headings of Annex I
 * Part A of Regulation (EC) No 1223/2009 with what Batchproof holds under each, then the four
 * headings of Part B with the assessor's text. A plain definition (no functions): it crosses to
 * the label PDF worker.
 */

export const DRAFT_MARK = 'DRAFT – NOT SIGNED';

/** Said on the first page and again at the end. */
export const PACKET_CAUTION =
  'Batchproof gathers the data and does the arithmetic; it does not judge safety. The qualified ' +
  'safety assessor decides and signs, and the law of each market where the product is sold ' +
  'applies (in the EU and UK, Article 10 of Regulation (EC) No 1223/2009 and its UK counterpart).';

/** A percentage as people read it: two decimals from 1 %, three significant digits below. */
export function percentText(percent: number): string {
  if (percent === 0) return '0 %';
  return `${percent >= 1 ? Number(percent.toFixed(2)) : Number(percent.toPrecision(3))} %`;
}

/** A dose or margin: whole from 100, three significant digits below. */
export function numberText(value: number): string {
  return value >= 100 ? Math.round(value).toString() : Number(value.toPrecision(3)).toString();
}

/** A value the assessor typed, as typed (float noise trimmed). */
const entered = (value: number) => String(Number(value.toPrecision(8)));
const orNone = (text: string | null | undefined, none = '—') => (text && text.trim() ? text : none);
const when = utcMinute;

const partA = (index: number) => ({
  text: `${index + 1}. ${PART_A_HEADINGS[index]}`,
  style: 'heading',
});
const sub = (text: string) => ({ text, style: 'subheading' });
/** A heading kept on the same page as the block after it (no heading alone at a page's foot). */
const keep = (...blocks: object[]) => ({ stack: blocks, unbreakable: true });
/**
 * A rough count of the lines a block takes (a wide text ~90 characters a line, a table cell ~24),
 * enough to tell a block that surely fits on a page from one that may not: pdfmake drops an
 * unbreakable block taller than a page, so only short ones are kept together.
 */
function linesOf(node: unknown, width = 90): number {
  if (typeof node === 'string') return Math.max(1, Math.ceil(node.length / width));
  if (Array.isArray(node)) return node.reduce((n: number, x) => n + linesOf(x, width), 0);
  if (node && typeof node === 'object') {
    const o = node as {
      table?: { body: unknown[][] };
      stack?: unknown;
      ul?: unknown;
      text?: unknown;
    };
    if (o.table)
      return o.table.body.reduce(
        (n: number, row) => n + Math.max(1, ...row.map((c) => linesOf(c, 24))),
        0,
      );
    if (o.stack) return linesOf(o.stack, width);
    if (o.ul) return linesOf(o.ul, width);
    if (typeof o.text === 'string') return linesOf(o.text, width) + 1;
  }
  return 1;
}
/** Most lines kept whole on one page with their heading (an A4 page holds about 50). */
const KEEP_LINES = 30;
/** The blocks on one page when they are surely short enough, else as they come. */
const together = (...blocks: object[]): object[] =>
  linesOf(blocks) <= KEEP_LINES ? [keep(...blocks)] : blocks;
const notes = (label: string, text: string) =>
  together(sub(label), { text: orNone(text, 'Not recorded by the maker.'), margin: [0, 0, 0, 6] });

function titleBlock(packet: SafetyPacket, hash: string) {
  const a = packet.assessment;
  const status =
    a.status === 'signed'
      ? `Signed by ${orNone(a.signedByName)}${a.signedAt ? ` on ${when(a.signedAt)}` : ''}`
      : 'Draft: not signed';
  const facts: [string, string][] = [
    ['Product', `${packet.formula.name} (${packet.formula.productType})`],
    [
      'Formula version',
      `Version ${packet.version.number}, ${packet.version.state}` +
        (packet.version.releasedAt ? `, released ${packet.version.releasedAt.slice(0, 10)}` : ''),
    ],
    ['Workshop', [packet.workshop.name, packet.workshop.address].filter(Boolean).join(', ')],
    ['Safety assessor', a.assessorName],
    ['Status', status],
    ['Content hash (SHA-256)', a.contentHash ?? hash],
    ['Generated', when(packet.generatedAt)],
  ];
  return [
    { text: 'Cosmetic product safety report', fontSize: 18, bold: true, margin: [0, 0, 0, 2] },
    {
      text: 'Annex I of Regulation (EC) No 1223/2009: Part A (safety information) and Part B (safety assessment)',
      fontSize: 10,
      margin: [0, 0, 0, 8],
    },
    {
      table: {
        widths: [120, '*'],
        body: facts.map(([label, value]) => [{ text: label, bold: true }, value]),
      },
      layout: 'noBorders',
      margin: [0, 0, 0, 8],
    },
    { text: PACKET_CAUTION, italics: true, fontSize: 9, margin: [0, 0, 0, 10] },
  ];
}

function composition(packet: SafetyPacket) {
  const rows: Cell[][] = packet.composition.map((c) => [
    String(c.position),
    c.materialName,
    orNone(c.inci),
    orNone(c.cas),
    orNone(c.ec),
    c.function,
    { text: percentText(c.percent) },
  ]);
  const fragrances = packet.composition.filter((c) => c.fragrance);
  return [
    ...together(
      partA(0),
      table(
        ['#', 'Material', 'INCI', 'CAS', 'EC', 'Function', '% w/w'],
        rows,
        [14, '*', '*', 58, 52, 70, 44],
        'The version has no lines.',
      ),
      { text: `Batch formula total: ${numberText(packet.totalGrams)} g.`, fontSize: 9 },
    ),
    ...(fragrances.length > 0
      ? together(
          sub('Fragrances: supplier and certificate'),
          table(
            ['Fragrance', 'Supplier', 'Code', 'Certificate on file'],
            fragrances.map((c) => [
              c.materialName,
              orNone(c.fragrance!.supplierName),
              orNone(c.fragrance!.code),
              c.fragrance!.certificate
                ? `${c.fragrance!.certificate.title}${c.fragrance!.certificate.issuedOn ? `, issued ${c.fragrance!.certificate.issuedOn}` : ''}`
                : 'None on file',
            ]),
            ['*', '*', 60, '*'],
            '',
          ),
        )
      : []),
  ];
}

function exposure(packet: SafetyPacket) {
  const e = packet.exposure;
  if (!e) return [keep(partA(5), { text: 'Not entered by the assessor yet.', italics: true })];
  const rows: [string, string][] = [
    [
      'Chosen as',
      e.presetLabel ? `${e.presetLabel} (shipped default)` : "The assessor's own values",
    ],
    ['Daily amount', `${entered(e.input.dailyAmountGrams)} g/day`],
    ['Retention factor', entered(e.input.retentionFactor)],
    ['Body weight', `${entered(e.input.bodyWeightKg)} kg`],
    [
      'A (exposure to the product)',
      `${numberText(e.exposureMgPerKgDay)} mg/kg bw/day${e.defaulted ? ' (default)' : ''}`,
    ],
    ['Source', orNone(e.source)],
  ];
  return [
    keep(partA(5), {
      table: { widths: [150, '*'], body: rows.map(([k, v]) => [{ text: k, bold: true }, v]) },
      layout: 'noBorders',
      margin: [0, 0, 0, 6],
    }),
  ];
}

function substances(packet: SafetyPacket) {
  const rows: Cell[][] = packet.margins.map((m) => {
    const s = packet.substances.find((x) => x.key === m.substanceKey);
    return [
      m.inci,
      orNone(s?.cas),
      percentText(m.percent),
      `${percentText(m.dermalAbsorptionPercent)}${m.absorptionDefaulted ? ' (default)' : ''}`,
      m.sedMgPerKgDay === null ? '—' : numberText(m.sedMgPerKgDay),
      orNone(s?.from.join(', ')),
    ];
  });
  return together(
    partA(6),
    {
      text: `SED = A × C / 100 × DAp / 100 (SCCS Notes of Guidance). Dermal absorption not entered is taken as ${DEFAULT_DERMAL_ABSORPTION_PERCENT} % and marked "default".`,
      fontSize: 9,
      margin: [0, 0, 0, 4],
    },
    table(
      ['Substance', 'CAS', 'C in product', 'Dermal absorption', 'SED (mg/kg bw/day)', 'From'],
      rows,
      ['*', 58, 56, 70, 64, '*'],
      'No substances.',
    ),
  );
}

function margins(packet: SafetyPacket) {
  const rows: Cell[][] = packet.margins.map((m) => [
    m.inci,
    m.pointOfDepartureMgPerKgDay === null
      ? 'Not entered'
      : numberText(m.pointOfDepartureMgPerKgDay),
    orNone(m.pointOfDepartureSource),
    m.marginOfSafety === null
      ? '—'
      : m.flagged
        ? { text: formatMargin(m.marginOfSafety), bold: true, color: '#b3261e' }
        : formatMargin(m.marginOfSafety),
    [
      m.flagged ? `Under ${MINIMUM_MARGIN_OF_SAFETY}` : '',
      m.absorptionDefaulted ? 'Absorption default' : '',
    ]
      .filter(Boolean)
      .join('; ') || '—',
  ]);
  return [
    ...together(
      partA(7),
      {
        text: `MoS = PoD_sys / SED; a margin under ${MINIMUM_MARGIN_OF_SAFETY} is flagged (SCCS Notes of Guidance).`,
        fontSize: 9,
        margin: [0, 0, 0, 4],
      },
      table(
        ['Substance', 'PoD (mg/kg bw/day)', 'Source of the PoD', 'MoS', 'Flags'],
        rows,
        ['*', 70, '*', 44, 90],
        'No substances.',
      ),
    ),
    ...(packet.attention.length > 0
      ? [
          sub('For the assessor’s attention'),
          { ul: packet.attention, fontSize: 9, margin: [0, 0, 0, 6] },
        ]
      : []),
  ];
}

function undesirableEffects(packet: SafetyPacket) {
  return together(
    partA(8),
    table(
      ['Received', 'What happened', 'Body area', 'Serious', 'Batch', 'Status'],
      packet.undesirableEffects.map((c) => [
        c.receivedOn,
        c.whatHappened,
        orNone(c.bodyArea),
        c.serious ? 'Yes' : 'No',
        orNone(c.batchCode),
        c.status,
      ]),
      [54, '*', 60, 40, 60, 40],
      'No complaints or undesirable effects recorded for this product.',
    ),
  );
}

const SEVERITY_WORDS = { block: 'Blocks', warn: 'Check', info: 'Note' } as const;

function marketInformation(m: SafetyPacket['markets'][number]) {
  return [
    ...together(
      sub(`Label copy: ${m.market}`),
      { text: orNone(m.declaration, 'No declaration.'), fontSize: 9, margin: [0, 0, 0, 2] },
      m.warnings.length > 0
        ? { ul: m.warnings, fontSize: 9, margin: [0, 0, 0, 4] }
        : { text: 'No warnings required by the checks.', italics: true, fontSize: 9 },
    ),
    ...together(
      sub(`Colourants: ${m.market}`),
      table(
        ['Colourant', 'CI', 'Verdict', '%', 'Conditions'],
        m.colourants.map((c) => [
          c.subject,
          orNone(c.colourIndex),
          c.verdict.replaceAll('-', ' '),
          percentText(c.totalPercent ?? c.percent),
          orNone(c.conditions.join('; ')),
        ]),
        ['*', 60, 90, 44, '*'],
        'No colourants.',
      ),
    ),
    ...together(
      sub(`Fragrance allergens: ${m.market}`),
      table(
        ['Allergen', '% in product', 'Threshold', 'Named on the label'],
        m.allergens.map((a) => [
          a.inci,
          percentText(a.percent),
          a.thresholdPercent === null ? 'No rule' : percentText(a.thresholdPercent),
          a.declared ? 'Yes' : 'No',
        ]),
        ['*', 70, 70, 90],
        'No fragrance allergens.',
      ),
    ),
  ];
}

const months = (n: number | null) => (n === null ? null : `${n} months`);

/** The label identity as a list of facts; the lines not entered are left out. */
function identityFacts(packet: SafetyPacket) {
  const id = packet.identity;
  if (!id) {
    return [
      sub('Label identity'),
      { text: 'No product identity entered for the labels yet.', italics: true, fontSize: 9 },
    ];
  }
  const facts: [string, string | null][] = [
    ['Product name on the label', id.productName],
    ['Shelf life', months(id.shelfLifeMonths)],
    ['Period after opening', months(id.periodAfterOpeningMonths)],
    ['EU responsible person', id.euResponsiblePerson],
    ['UK responsible person', id.ukResponsiblePerson],
    ['US adverse-event contact', id.usAdverseEventContact],
  ];
  return [
    keep(sub('Label identity'), {
      table: {
        widths: [150, '*'],
        body: facts.map(([label, value]) => [{ text: label, bold: true }, orNone(value)]),
      },
      layout: 'noBorders',
      fontSize: 9,
      margin: [0, 0, 0, 6],
    }),
  ];
}

function productInformation(packet: SafetyPacket) {
  const { findings, documentsOnFile, documentsMissing, batches } = packet;
  return [
    keep(
      partA(9),
      packet.markets.length === 0
        ? { text: 'The version has not been checked yet.', italics: true }
        : {
            text: `Checked for ${packet.markets.map((m) => m.market).join(', ')}.`,
            fontSize: 9,
          },
    ),
    ...identityFacts(packet),
    ...packet.markets.flatMap(marketInformation),
    ...together(
      sub('Findings of the compliance checks'),
      table(
        ['', 'Market', 'About', 'Finding'],
        findings.map((f) => [
          SEVERITY_WORDS[f.severity],
          f.market ?? 'All',
          f.subject,
          { text: f.message, fontSize: 8 },
        ]),
        [40, 40, 90, '*'],
        'No findings.',
      ),
    ),
    ...together(
      sub('Supplier documents on file'),
      table(
        ['Material', 'Document', 'Title', 'Issued'],
        documentsOnFile.map((d) => [d.materialName, d.kind, d.title, orNone(d.issuedOn)]),
        ['*', 100, '*', 60],
        'None on file.',
      ),
    ),
    ...together(
      sub('Supplier documents missing'),
      table(
        ['Material', 'Missing'],
        documentsMissing.map((d) => [d.materialName, d.what]),
        ['*', '*'],
        'None missing.',
      ),
    ),
    ...together(
      sub('Batches made from this version'),
      table(
        ['Batch code', 'Made on', 'Units made', 'State'],
        batches.map((b) => [
          b.code,
          b.madeOn,
          b.unitsMade === null ? '—' : String(b.unitsMade),
          b.status,
        ]),
        ['*', 70, 60, 60],
        'No batches made yet.',
      ),
    ),
  ];
}

function partB(packet: SafetyPacket) {
  const texts = [
    packet.partB.conclusion,
    packet.partB.labelWarnings,
    packet.partB.reasoning,
    packet.partB.credentials,
  ];
  const a = packet.assessment;
  return [
    {
      text: 'Part B: cosmetic product safety assessment',
      fontSize: 15,
      bold: true,
      pageBreak: 'before',
      margin: [0, 0, 0, 6],
    },
    ...PART_B_HEADINGS.flatMap((heading, i): object[] => {
      const text = orNone(texts[i], 'Not written yet.');
      const blocks: object[] = [
        { text: `${i + 1}. ${heading}`, style: 'heading' },
        { text, margin: [0, 0, 0, 6] },
      ];
      // A short text stays with its heading; a long one may run over pages.
      return together(...blocks);
    }),
    a.status === 'signed'
      ? {
          text: `Signed by ${orNone(a.signedByName)}${a.signedAt ? ` on ${when(a.signedAt)}` : ''}. SHA-256 of the content signed: ${orNone(a.contentHash)}`,
          bold: true,
          margin: [0, 10, 0, 6],
        }
      : { text: 'Not signed.', bold: true, margin: [0, 10, 0, 6] },
    { text: PACKET_CAUTION, italics: true, fontSize: 9 },
  ];
}

/** The packet's pdfmake definition (A4 portrait). */
export function packetDocument(packet: SafetyPacket, opts: { draft: boolean; hash: string }) {
  const n = packet.notes;
  const title = `Safety report ${packet.formula.name} v${packet.version.number}`;
  return {
    info: { title, creator: 'Batchproof', producer: 'Batchproof' },
    pageSize: 'A4',
    pageMargins: [40, 48, 40, 40],
    defaultStyle: { font: LABEL_FONT_FAMILY, fontSize: 10 },
    footer: {
      text: `${packet.formula.name}, version ${packet.version.number} · SHA-256 ${packet.assessment.contentHash ?? opts.hash}`,
      fontSize: 7,
      color: '#555555',
      margin: [40, 12, 40, 0],
    },
    styles: {
      heading: { fontSize: 13, bold: true, margin: [0, 10, 0, 4] },
      subheading: { fontSize: 10, bold: true, margin: [0, 4, 0, 2] },
    },
    ...(opts.draft
      ? {
          header: {
            text: DRAFT_MARK,
            alignment: 'center',
            bold: true,
            color: '#b3261e',
            margin: [0, 18, 0, 0],
          },
          watermark: { text: DRAFT_MARK, color: '#b3261e', opacity: 0.12, bold: true },
        }
      : {}),
    content: [
      ...titleBlock(packet, opts.hash),
      {
        text: 'Part A: cosmetic product safety information',
        fontSize: 15,
        bold: true,
        margin: [0, 0, 0, 2],
      },
      ...composition(packet),
      ...together(partA(1), ...notes('Physical and chemical characteristics', n.physicalChemical)),
      ...notes('Stability', n.stability),
      ...together(partA(2), ...notes('Microbiological quality', n.microbiological)),
      ...together(partA(3), ...notes('Impurities and traces', n.impurities)),
      ...notes('Packaging material', n.packaging),
      ...together(partA(4), ...notes('Normal and reasonably foreseeable use', n.normalUse)),
      ...notes('Directions for use on the label', packet.identity?.directions ?? ''),
      ...exposure(packet),
      ...substances(packet),
      ...margins(packet),
      ...undesirableEffects(packet),
      ...productInformation(packet),
      ...partB(packet),
    ],
  };
}
