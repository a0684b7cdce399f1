import { ref } from 'vue';
import { describe, expect, it } from 'vitest';
import { readingCreateSchema } from '@shared/schemas/readings';
import type { Message } from '@shared/schemas/tickets';
import { fieldOfError, fromReading, readingCardOf, toReadingCreate } from './readingForm';
import { createQuantity, type CheckUnits } from './useCheckUnits';

const units = (): CheckUnits => ({ pressure: ref('in_wc'), temperature: ref('f'), power: ref('btuh') });
const event = (data: Message['data']): Pick<Message, 'kind' | 'data'> => ({ kind: 'event', data });

describe('reading form shaping', () => {
  it('When a manifold reading is typed in Pa, then it is sent in in. w.c. (NIST SP 811: 1 in. w.c. = 249.08891 Pa)', () => {
    const u = units();
    u.pressure.value = 'pa';
    const high = createQuantity('pressure', u);
    high.text.value = '1046.17';
    const sent = toReadingCreate('gas-pressure', { 'manifold.high': high.value.value }, 'high');
    expect(sent.kind).toBe('gas-pressure');
    const manifold = sent.kind === 'gas-pressure' ? sent.values.manifold : [];
    expect(manifold).toHaveLength(1);
    expect(manifold[0]!.stage).toBe('high');
    expect(manifold[0]!.valueInWc).toBeCloseTo(4.2, 4);
    expect(readingCreateSchema.safeParse(sent).success).toBe(true);
  });

  it('When 8.72 mbar is typed, then 3.5 in. w.c. is sent (1 mbar = 100 Pa)', () => {
    const u = units();
    u.pressure.value = 'mbar';
    const q = createQuantity('pressure', u);
    q.text.value = '8.718';
    const sent = toReadingCreate('gas-pressure', { inletStaticInWc: q.value.value }, 'high');
    expect(sent.values).toEqual({ inletStaticInWc: expect.closeTo(3.5, 3) as number, manifold: [] });
  });

  it('When temperatures are typed in °C, then °F are sent with the stage', () => {
    const u = units();
    u.temperature.value = 'c';
    const supply = createQuantity('temperature', u);
    const ret = createQuantity('temperature', u);
    supply.text.value = '50';
    ret.text.value = '20';
    const sent = toReadingCreate(
      'temperature-rise',
      { supplyF: supply.value.value, returnF: ret.value.value },
      'low',
    );
    expect(sent.values).toEqual({ supplyF: 122, returnF: 68, stage: 'low' });
  });

  it('When a field is blank, then it is left out so the server default applies', () => {
    const sent = toReadingCreate('firing-rate', { dialCuFt: 1, secondsPerRev: 36 }, 'high');
    expect(sent.values).toEqual({ dialCuFt: 1, secondsPerRev: 36 });
    const gas = toReadingCreate('gas-pressure', {}, 'high');
    expect(readingCreateSchema.safeParse(gas).success).toBe(false);
  });

  it('When a stored reading is run again, then its values come back per field', () => {
    const back = fromReading({
      kind: 'gas-pressure',
      values: { inletStaticInWc: 7, manifold: [{ stage: 'low', valueInWc: 1.6 }] },
    });
    expect(back.numbers).toEqual({ inletStaticInWc: 7, 'manifold.low': 1.6 });
    expect(
      fromReading({ kind: 'temperature-rise', values: { supplyF: 130, returnF: 70, stage: 'low' } }),
    ).toEqual({
      numbers: { supplyF: 130, returnF: 70 },
      stage: 'low',
    });
  });

  it('When the server names a field, then the error lands on that field; the n-th manifold entry is its stage', () => {
    const sent = toReadingCreate('gas-pressure', { 'manifold.single': 3, 'manifold.low': 99 }, 'high');
    expect(fieldOfError('values.manifold.1.valueInWc', sent)).toBe('manifold.low');
    expect(fieldOfError('values.manifold', sent)).toBe('manifold');
    const co = toReadingCreate('co-air-free', { coPpm: 40, o2Pct: 21 }, 'high');
    expect(fieldOfError('values.o2Pct', co)).toBe('o2Pct');
    expect(fieldOfError('kind', co)).toBeNull();
    expect(fieldOfError('values.somethingElse', co)).toBeNull();
  });

  it('When an event message carries a reading, then its card is read; other messages give none', () => {
    const result = { items: [], source: 's', cautions: [] };
    expect(
      readingCardOf(event({ type: 'reading', readingId: 1, kind: 'gas-pressure', verdict: 'high', result })),
    ).toEqual({ kind: 'gas-pressure', verdict: 'high', result });
    expect(
      readingCardOf(event({ type: 'reading', kind: 'co-air-free', verdict: null, result }))?.verdict,
    ).toBeNull();
    expect(readingCardOf(event({ type: 'status', to: 'resolved' }))).toBeNull();
    expect(readingCardOf(event(null))).toBeNull();
    expect(
      readingCardOf({ kind: 'message', data: { type: 'reading', kind: 'gas-pressure', result } }),
    ).toBeNull();
    expect(readingCardOf(event({ type: 'reading', kind: 'unknown', result }))).toBeNull();
  });
});
