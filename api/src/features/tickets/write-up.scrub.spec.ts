import { describe, expect, it } from 'vitest';
import { MARKERS, Scrubber, scrubText, type ScrubContext } from './write-up.scrub';

// Invented people and places of the demo scenario; phone numbers in the 555-01xx range, which is
// set aside for fiction in the North American numbering plan (common practice, no source).
const context: ScrubContext = {
  names: ['Dana Whitfield', 'Rowan Fielding'],
  companies: ['Keane Heating & Air Inc.'],
  emails: ['dana.whitfield@keane.test'],
  serial: 'CV2319A04512',
  keepSerial: false,
};
const scrub = (text: string, extra: Partial<ScrubContext> = {}) => scrubText(text, { ...context, ...extra });

describe('phone numbers', () => {
  const formats = [
    '207-555-0143',
    '(207) 555-0143',
    '207.555.0143',
    '207 555 0143',
    '2075550143',
    '+1 207 555 0143',
    '1-800-555-0199',
    '(613)555-0101',
    '416 555 0188 ext. 12',
  ];
  for (const phone of formats) {
    it(`When the text has the number "${phone}", then it is replaced and listed`, () => {
      const { text, removed } = scrub(`Call me back at ${phone} when you can.`);
      expect(text).toBe(`Call me back at ${MARKERS.phone} when you can.`);
      expect(removed).toEqual([{ kind: 'phone', text: phone }]);
    });
  }

  it('When a seven-digit local number follows a phone word, then it goes too', () => {
    const { text } = scrub('my cell is 555-0143, text anytime');
    expect(text).toBe(`my cell is ${MARKERS.phone}, text anytime`);
  });

  it('When the text has the trade figures of a furnace, then none of them is taken for a phone number', () => {
    const readings =
      'Inlet 7.0 in. w.c. static, 6.4 under fire; manifold 3.5 high, 1.7 low; 80,000 Btu/h; rise 45-75 °F; CV-T96-80; 1200 rpm; 0.5 psi.';
    const { text, removed } = scrub(readings);
    expect(text).toBe(readings);
    expect(removed).toEqual([]);
  });
});

describe('e-mail addresses', () => {
  it('When e-mail addresses of several shapes are in the text, then each is replaced', () => {
    const { text, removed } = scrub(
      'Send it to dana.whitfield@keane.test or office+tickets@mail.keane-hvac.example, cc R.F_2@sub.domain.co.',
    );
    expect(text).toBe(`Send it to ${MARKERS.email} or ${MARKERS.email}, cc ${MARKERS.email}.`);
    expect(removed.map((r) => r.text)).toEqual([
      'dana.whitfield@keane.test',
      'office+tickets@mail.keane-hvac.example',
      'R.F_2@sub.domain.co',
    ]);
  });
});

describe('street addresses', () => {
  const addresses: [string, string][] = [
    ['1187 North Ridge Road', 'the job at 1187 North Ridge Road today'],
    // A trailing dot stays in the text, as it may end the sentence.
    ['42 Elm St', 'we are at 42 Elm St. in the basement'],
    ['9 Old Mill Ln', 'at 9 Old Mill Ln, side door'],
    ['310 W Lakeshore Blvd, Apt 4B', 'customer at 310 W Lakeshore Blvd, Apt 4B has no heat'],
    ['88 5th Avenue, Millbrook, NY 12545', 'billing 88 5th Avenue, Millbrook, NY 12545 please'],
    ['17 Harbor View Drive', 'unit at 17 Harbor View Drive'],
    ['2250 Northfield Pkwy, Unit 3', 'house is 2250 Northfield Pkwy, Unit 3'],
    ['55 birch lane', 'lowercase 55 birch lane off the highway'],
    ['PO Box 118', 'mail the part to PO Box 118 please'],
    ['12 Maple Crescent, Eastgate, ON K2P 1L4', 'in Canada: 12 Maple Crescent, Eastgate, ON K2P 1L4.'],
  ];
  for (const [address, sentence] of addresses) {
    it(`When the text has "${address}", then the address is replaced`, () => {
      const { text, removed } = scrub(sentence);
      expect(text).toBe(sentence.replace(address, MARKERS.address));
      expect(removed).toEqual([{ kind: 'address', text: address }]);
    });
  }

  it('When trade words look a little like a street, then they stay', () => {
    const trade = [
      'a 1/2 hp direct drive blower',
      'replaced the 3 way valve',
      'set the 2 stage thermostat in place',
      'check the 24 volt circuit at the board',
    ];
    for (const sentence of trade) expect(scrub(sentence).text).toBe(sentence);
  });
});

describe('names, company and serial', () => {
  it('When the contractor, a teammate and the company are named, then each is replaced', () => {
    const { text, removed } = scrub(
      'Rowan Fielding here from Keane Heating & Air. Dana will call back; ask for rowan fielding.',
    );
    expect(text).toBe(
      `${MARKERS.name} here from ${MARKERS.company}. ${MARKERS.name} will call back; ask for ${MARKERS.name}.`,
    );
    expect(removed).toEqual([
      { kind: 'company', text: 'Keane Heating & Air' },
      { kind: 'name', text: 'Rowan Fielding' },
      { kind: 'name', text: 'Dana' },
    ]);
  });

  it('When the company is written with "and" or its legal ending, then it is replaced all the same', () => {
    expect(scrub('Keane Heating and Air sent it').text).toBe(`${MARKERS.company} sent it`);
    expect(scrub('invoice to Keane Heating & Air Inc.').text).toBe(`invoice to ${MARKERS.company}.`);
  });

  it('When a surname is also a plain word, then only the capitalised name goes', () => {
    const { text } = scrub('frost on the coil; Frost said so', { names: ['Sam Frost'] });
    expect(text).toBe(`frost on the coil; ${MARKERS.name} said so`);
  });

  it('When the serial is written with spaces or in lower case, or another S/N is given, then they are removed', () => {
    const { text, removed } = scrub('Serial CV 2319 A04512, or cv2319a04512; old unit S/N: 44-1187B.');
    expect(text).toBe(`Serial ${MARKERS.serial}, or ${MARKERS.serial}; old unit S/N: ${MARKERS.serial}.`);
    expect(removed.map((r) => r.kind)).toEqual(['serial', 'serial', 'serial']);
  });

  it('When the serial is kept on purpose, then it stays and nothing is listed for it', () => {
    const { text, removed } = scrub('Serial CV2319A04512 on the plate.', { keepSerial: true });
    expect(text).toBe('Serial CV2319A04512 on the plate.');
    expect(removed).toEqual([]);
  });

  it('When a serial number looks like a phone number, then it is removed as the serial, not as a phone', () => {
    const { text, removed } = scrub('S/N 2075550143', { serial: '2075550143' });
    expect(text).toBe(`S/N ${MARKERS.serial}`);
    expect(removed).toEqual([{ kind: 'serial', text: '2075550143' }]);
  });
});

describe('one scrubber over several texts', () => {
  it('When the same number appears in two messages, then it is listed once', () => {
    const s = new Scrubber(context);
    s.scrub('call 207-555-0143');
    s.scrub('again: 207-555-0143');
    expect(s.removed).toEqual([{ kind: 'phone', text: '207-555-0143' }]);
  });
});
