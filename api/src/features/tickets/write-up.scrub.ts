import { findPhoneNumbersInText } from 'libphonenumber-js';
import type { RemovedItem, RemovedKind } from '../../../../shared/src/index';

/**
 * Takes contact details out of a ticket's text before it becomes an article: the contractor's
 * people and company, phone numbers, e-mail addresses, street addresses and (unless kept) the
 * unit's serial number. Each piece is replaced by a neutral marker and listed, so the reviewer
 * sees exactly what went. When in doubt it removes: a marker too many is fixed in review, a phone
 * number too many is published.
 */
export interface ScrubContext {
  /** Full names of the contractor and their teammates. */
  names: string[];
  /** The contractor company's name. */
  companies: string[];
  /** Addresses the account's people sign in with; any other e-mail address is caught by pattern. */
  emails: string[];
  /** The ticket's serial number, and whether to keep it (and serial numbers mentioned in the text). */
  serial: string | null;
  keepSerial: boolean;
}

export const MARKERS: Record<RemovedKind, string> = {
  name: '[name removed]',
  company: '[company removed]',
  phone: '[phone removed]',
  email: '[e-mail removed]',
  address: '[address removed]',
  serial: '[serial number removed]',
};

const escapeRe = (s: string) => s.replace(/[.*+?^${}()|[\]\\]/g, '\\$&');

// No maintained package finds e-mail addresses or street addresses in free text, so these two are
// our own patterns; phone numbers come from libphonenumber-js.
const EMAIL = /[A-Za-z0-9._%+-]+@[A-Za-z0-9-]+(?:\.[A-Za-z0-9-]+)*\.[A-Za-z]{2,}/g;

// Street suffixes as written on envelopes in the US and Canada (common practice, no source).
const SUFFIXES =
  'Street|St|Avenue|Ave|Av|Road|Rd|Boulevard|Blvd|Drive|Dr|Lane|Ln|Court|Ct|Place|Pl|Way|Terrace|Ter|' +
  'Circle|Cir|Parkway|Pkwy|Highway|Hwy|Route|Rte|Trail|Trl|Square|Sq|Crescent|Cres|Row|Pike|Alley|Close|Loop';
// Lower-case words like "drive", "way", "place" are everyday trade words ("direct drive", "3-way
// valve"); typed all in lower case, only the unmistakable suffixes count as a street.
const PLAIN_SUFFIXES = 'street|st|avenue|ave|road|rd|boulevard|blvd|lane|ln|court|ct|pkwy|hwy';
const HOUSE_NUMBER = String.raw`(?<![\w/.,-])\d{1,6}(?:-\d{1,4})?[A-Za-z]?`;
const DIRECTION = String.raw`(?:(?:N|S|E|W|NE|NW|SE|SW)\.?|North|South|East|West)`;
const UNIT = String.raw`(?:,?\s+(?:Apt|Apartment|Unit|Suite|Ste|#)\.?\s*[A-Za-z0-9-]+)?`;
const CITY_TAIL =
  String.raw`(?:,\s*[A-Z][a-z]+(?:\s+[A-Z][a-z]+){0,2}(?:,\s*|\s+)[A-Z]{2}` +
  String.raw`(?:\s+(?:\d{5}(?:-\d{4})?|[A-Z]\d[A-Z]\s?\d[A-Z]\d))?)?`;
const CAPITALISED = String.raw`(?:[A-Z][A-Za-z'.-]*|\d+(?:st|nd|rd|th))`;
const STREET = new RegExp(
  String.raw`${HOUSE_NUMBER}\s+(?:${DIRECTION}\s+)?(?:${CAPITALISED}\s+){1,4}(?:${SUFFIXES})\b\.?${UNIT}${CITY_TAIL}`,
  'g',
);
const STREET_LOWER = new RegExp(
  String.raw`${HOUSE_NUMBER}\s+(?:[a-z]+\s+){1,3}(?:${PLAIN_SUFFIXES})\b\.?${UNIT}`,
  'g',
);
const PO_BOX = /\bP\.?\s?O\.?\s+Box\s+\d+\b/gi;
/** "S/N 44-1187", "serial no. X1187A", "serial: ..." — the token after the word. */
const SERIAL_MENTION = /\b(?:S\/N|serial(?:\s+(?:number|no\.?|#))?)\s*[:#]?\s*([A-Z0-9][A-Z0-9-]{3,})/gi;
/** A seven-digit local number needs a phone word in front; the library wants an area code. */
const LOCAL_PHONE = /\b(?:call|cell|phone|tel|text|mobile|office)\b[^\d\n]{0,12}(\d{3}[-. ]\d{4})\b/gi;
// Company names are often written without their legal ending.
const LEGAL_ENDING = /[,\s]+(?:inc|llc|ltd|co|corp|corporation|company|limited)\.?$/i;

export class Scrubber {
  private readonly found = new Map<string, RemovedItem>();
  constructor(private readonly context: ScrubContext) {}

  /** Everything removed so far, once each, in the order first found. */
  get removed(): RemovedItem[] {
    return [...this.found.values()];
  }

  scrub(text: string): string {
    const c = this.context;
    let out = text;
    if (!c.keepSerial) {
      if (c.serial && c.serial.replace(/[^A-Za-z0-9]/g, '').length >= 4) {
        out = this.replace(out, 'serial', serialPattern(c.serial));
      }
      out = out.replace(SERIAL_MENTION, (whole, token: string) => {
        // Only tokens with a digit: "serial number plate" is not a serial number.
        if (!/\d/.test(token) || token.startsWith('[')) return whole;
        this.note('serial', token);
        return whole.slice(0, whole.length - token.length) + MARKERS.serial;
      });
    }
    out = this.replace(out, 'email', EMAIL);
    for (const e of c.emails) out = this.replace(out, 'email', new RegExp(escapeRe(e), 'gi'));
    out = this.phones(out);
    out = this.replace(out, 'address', STREET);
    out = this.replace(out, 'address', STREET_LOWER);
    out = this.replace(out, 'address', PO_BOX);
    out = this.companies(out);
    out = this.names(out);
    return out;
  }

  private phones(text: string): string {
    // Right to left, so earlier offsets stay valid while replacing.
    const found = findPhoneNumbersInText(text, 'US').sort((a, b) => b.startsAt - a.startsAt);
    let out = text;
    for (const f of found) {
      this.note('phone', out.slice(f.startsAt, f.endsAt));
      out = out.slice(0, f.startsAt) + MARKERS.phone + out.slice(f.endsAt);
    }
    return out.replace(LOCAL_PHONE, (whole, number: string) => {
      this.note('phone', number);
      return whole.slice(0, whole.length - number.length) + MARKERS.phone;
    });
  }

  private companies(text: string): string {
    let out = text;
    const forms = this.context.companies.flatMap((name) => {
      const bare = name.trim().replace(LEGAL_ENDING, '');
      const variants = [
        name.trim(),
        bare,
        bare.replace(/\s*&\s*/g, ' and '),
        bare.replace(/\s+and\s+/gi, ' & '),
      ];
      return [...new Set(variants)].filter((v) => v.length >= 3);
    });
    // Longest first, so "Keane Heating & Air Inc" goes whole before "Keane Heating & Air".
    for (const form of forms.sort((a, b) => b.length - a.length)) {
      out = this.replace(out, 'company', new RegExp(wordBounded(escapeRe(form)), 'giu'));
    }
    return out;
  }

  private names(text: string): string {
    let out = text;
    const full = this.context.names.map((n) => n.trim().replace(/\s+/g, ' ')).filter((n) => n.length >= 2);
    for (const name of [...full].sort((a, b) => b.length - a.length)) {
      out = this.replace(out, 'name', new RegExp(wordBounded(escapeRe(name).replace(/ /g, '\\s+')), 'giu'));
    }
    // A first or last name alone, as written with its capital ("thanks Dana"): case-sensitive, so
    // a surname that is also a word ("Frost") is only taken where it is capitalised.
    const parts = new Set(full.flatMap((n) => n.split(' ')).filter((p) => p.length >= 2));
    for (const part of parts) {
      const capitalised = part.charAt(0).toUpperCase() + part.slice(1);
      out = this.replace(out, 'name', new RegExp(wordBounded(escapeRe(capitalised)), 'gu'));
    }
    return out;
  }

  private replace(text: string, kind: RemovedKind, pattern: RegExp): string {
    return text.replace(pattern, (match: string) => {
      const trimmed = match.replace(/[\s,.]+$/, '');
      const rest = match.slice(trimmed.length);
      this.note(kind, trimmed);
      return MARKERS[kind] + rest;
    });
  }

  private note(kind: RemovedKind, text: string) {
    const key = `${kind}\u0000${text.toLowerCase()}`;
    if (!this.found.has(key)) this.found.set(key, { kind, text });
  }
}

/** Letters and digits of the serial, with an optional dash or space between any two. */
function serialPattern(serial: string): RegExp {
  const chars = serial
    .replace(/[^A-Za-z0-9]/g, '')
    .split('')
    .map(escapeRe);
  return new RegExp(wordBounded(chars.join('[-\\s]?')), 'giu');
}

/** \b does not work next to "&" or "." at a name's edge; look at the neighbours instead. */
const wordBounded = (pattern: string) => `(?<![\\p{L}\\p{N}])${pattern}(?![\\p{L}\\p{N}])`;

/** Convenience for one text. */
export function scrubText(text: string, context: ScrubContext): { text: string; removed: RemovedItem[] } {
  const s = new Scrubber(context);
  return { text: s.scrub(text), removed: s.removed };
}
