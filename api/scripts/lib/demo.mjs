// The demo sign-ins the seed creates (invented people of the demo scenario in DESIGN.md).
export const DEMO_PASSWORD = 'Harbor-Valley-2026';

export const DEMO_LOGINS = [
  ['admin@harborvalley.example', 'admin', 'Harbor Valley Supply'],
  ['tech.eastgate@harborvalley.example', 'tech', 'Eastgate branch desk'],
  ['tech.millbrook@harborvalley.example', 'tech', 'Millbrook branch desk'],
  ['tech.northfield@harborvalley.example', 'tech', 'Northfield branch desk'],
  ['specialist@harborvalley.example', 'specialist', 'product specialist'],
  ['owner@keaneheating.example', 'contractor (owner)', 'Keane Heating & Air'],
  ['tech@keaneheating.example', 'contractor', 'Keane Heating & Air'],
  ['owner@brightline.example', 'contractor (owner)', 'Brightline Mechanical'],
  ['tech@brightline.example', 'contractor', 'Brightline Mechanical'],
  ['owner@summitcomfort.example', 'contractor (owner)', 'Summit Comfort Services'],
  ['tech@summitcomfort.example', 'contractor', 'Summit Comfort Services'],
  ['owner@ridgeway.example', 'contractor (owner)', 'Ridgeway Plumbing & Heating'],
  ['tech@ridgeway.example', 'contractor', 'Ridgeway Plumbing & Heating'],
];

export function loginsTable() {
  const header = ['e-mail', 'role', 'for'];
  const rows = [header, ...DEMO_LOGINS];
  const widths = header.map((_, i) => Math.max(...rows.map((row) => row[i].length)));
  const line = (row) => `  ${row.map((cell, i) => cell.padEnd(widths[i])).join('  ')}`.trimEnd();
  return [
    line(header),
    `  ${widths.map((w) => '-'.repeat(w)).join('  ')}`,
    ...DEMO_LOGINS.map(line),
    '',
    `  password for all: ${DEMO_PASSWORD}`,
  ].join('\n');
}
