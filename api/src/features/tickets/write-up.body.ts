import type { Fuel, Reading } from '../../../../shared/src/index';

/**
 * The Markdown of a written-up ticket, in the knowledge base's own style: plain sections, the
 * standard caution block when gas is involved, readings as a table with their verdicts. Every text
 * passed in has been scrubbed already; this only arranges it.
 */
export interface WriteUpParts {
  subject: string;
  description: string;
  equipment: string | null;
  fuel: Fuel;
  serial: string | null;
  readings: Reading[];
  answer: { side: 'desk' | 'site'; note: boolean; body: string }[];
  resolution: string | null;
  photos: { url: string; alt: string }[];
}

const FUEL_LABEL: Record<Fuel, string> = {
  'natural-gas': 'Natural gas',
  propane: 'Propane (LP)',
  other: 'Other / not gas',
};

/** The same wording the seed articles use for their gas caution. */
export const GAS_CAUTION_BLOCK = [
  '::: caution',
  "Gas work is for qualified, licensed technicians only. Follow the manufacturer's installation instructions and the local code (NFPA 54/ANSI Z223.1 in the US, CSA B149.1 in Canada), which override this article. Shut the gas off before opening a test port, leak-test every fitting you opened, and check for CO before you leave.",
  ':::',
].join('\n');

/** Text typed in the chat stays text: no custom block may open or close inside it. */
const asText = (s: string) =>
  s
    .trim()
    .replace(/\r\n?/g, '\n')
    .replace(/^(\s*):::/gm, '$1\\:::');

const cell = (s: string) => s.replace(/\|/g, '\\|').replace(/\n/g, ' ');
const num = (v: unknown) => (typeof v === 'number' && Number.isFinite(v) ? v : null);
const VERDICT = { ok: 'within spec', low: 'low', high: 'high' } as const;
const verdictText = (v: unknown) => (v === 'ok' || v === 'low' || v === 'high' ? VERDICT[v] : 'recorded');

const GAS_ITEM: Record<string, string> = {
  'inlet-static': 'Inlet gas pressure, static',
  'inlet-under-fire': 'Inlet gas pressure, under fire',
  'inlet-drop': 'Inlet drop, static to under fire',
  'manifold-single': 'Manifold pressure',
  'manifold-high': 'Manifold pressure, high fire',
  'manifold-low': 'Manifold pressure, low fire',
};

type Row = [what: string, measured: string, expected: string, verdict: string];

/** One reading as table rows: what was measured, against what, and the check's verdict. */
export function readingRows(reading: Pick<Reading, 'kind' | 'values' | 'result' | 'verdict'>): Row[] {
  const r = reading.result;
  const v = reading.values;
  switch (reading.kind) {
    case 'gas-pressure': {
      const items = Array.isArray(r.items) ? (r.items as Record<string, unknown>[]) : [];
      return items.map((item) => {
        const target = num(item.targetInWc);
        const range = `${num(item.minInWc) ?? '?'}–${num(item.maxInWc) ?? '?'} in. w.c.`;
        return [
          GAS_ITEM[String(item.name)] ?? String(item.name),
          `${num(item.valueInWc) ?? '?'} in. w.c.`,
          target === null ? range : `${target} in. w.c. (${range})`,
          verdictText(item.verdict),
        ];
      });
    }
    case 'temperature-rise':
      return [
        [
          'Temperature rise',
          `${num(r.riseF) ?? '?'} °F (supply ${num(v.supplyF) ?? '?'} °F, return ${num(v.returnF) ?? '?'} °F)`,
          'the unit’s rated rise range',
          verdictText(reading.verdict),
        ],
        ...(num(r.airflowCfm) !== null
          ? ([['Airflow worked out from the rise', `about ${num(r.airflowCfm)} cfm`, '—', '—']] as Row[])
          : []),
      ];
    case 'firing-rate':
      return [
        [
          'Firing rate (gas meter clocked)',
          `${num(r.inputBtuh) ?? '?'} Btu/h (${num(r.cfh) ?? '?'} cfh)`,
          num(r.percentOfRated) !== null ? `rated input (${num(r.percentOfRated)} % of it)` : 'rated input',
          verdictText(reading.verdict),
        ],
      ];
    case 'co-air-free':
      return [
        [
          'Air-free CO in the flue gas',
          `${num(r.coAirFreePpm) ?? '?'} ppm (${num(v.coPpm) ?? '?'} ppm as measured at ${num(v.o2Pct) ?? '?'} % O₂)`,
          'the manufacturer’s limit',
          'recorded',
        ],
      ];
  }
}

export function writeUpBody(parts: WriteUpParts): string {
  const out: string[] = [];
  const gas = parts.fuel !== 'other';

  out.push('## The problem', '', asText(parts.subject) + (/[.!?]$/.test(parts.subject.trim()) ? '' : '.'));
  if (parts.description.trim()) out.push('', asText(parts.description));
  out.push('', `- **Equipment:** ${parts.equipment ? asText(parts.equipment) : 'not given on the ticket'}`);
  out.push(`- **Fuel:** ${FUEL_LABEL[parts.fuel]}`);
  if (parts.serial) out.push(`- **Serial number:** ${asText(parts.serial)}`);
  if (gas) out.push('', GAS_CAUTION_BLOCK);

  out.push('', '## Readings', '');
  const rows = parts.readings.flatMap(readingRows);
  if (rows.length === 0) out.push('No readings were recorded on the ticket.');
  else {
    out.push('| reading | measured | expected | verdict |', '| --- | --- | --- | --- |');
    for (const row of rows) out.push(`| ${row.map(cell).join(' | ')} |`);
    out.push(
      '',
      'Verdicts are from the checks at the time, against the unit’s spec table where there was one.',
    );
  }

  out.push('', '## The answer', '');
  if (parts.answer.length === 0) out.push('_Write the answer here._');
  for (const [i, m] of parts.answer.entries()) {
    if (i > 0) out.push('');
    const who = m.side === 'desk' ? (m.note ? 'Desk (internal note)' : 'Desk') : 'On site';
    out.push(`**${who}:** ${asText(m.body)}`);
  }

  out.push(
    '',
    '## How it was resolved',
    '',
    parts.resolution?.trim() ? asText(parts.resolution) : '_Not recorded._',
  );

  if (parts.photos.length) {
    out.push('', '## Photos', '');
    for (const p of parts.photos) out.push(`![${p.alt}](${p.url})`, '');
    out.pop();
  }
  return out.join('\n') + '\n';
}
