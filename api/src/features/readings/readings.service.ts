import { randomUUID } from 'node:crypto';
import type { AppContext } from '../../context';
import type { Message, Reading, ReadingCreate, SessionUser } from '../../../../shared/src/index';
import {
  checkGasPressure,
  coAirFree,
  firingRate,
  temperatureRise,
  TYPICAL_SPEC,
} from '../../../../shared/src/calc/index';
import { equipmentSpecSchema, type EquipmentSpec } from '../../../../shared/src/schemas/equipmentSpec';
import { findModel } from '../equipment/equipment.repository';
import { fanOut } from '../tickets/messages.service';
import { insertMessageOnce, findMessage } from '../tickets/messages.repository';
import { findTicket } from '../tickets/tickets.repository';
import { loadScope } from '../tickets/tickets.service';
import * as repo from './readings.repository';

type Verdict = 'low' | 'ok' | 'high';
const worst = (verdicts: (Verdict | undefined)[]): Verdict | null => {
  const known = verdicts.filter((v): v is Verdict => !!v);
  if (known.length === 0) return null;
  return known.find((v) => v !== 'ok') ?? 'ok';
};

/** Runs the reading's check against what is known of the unit: its catalogue spec, else common practice. */
export function judge(reading: ReadingCreate, fuel: string, spec: EquipmentSpec | null) {
  switch (reading.kind) {
    case 'gas-pressure': {
      const gasFuel = fuel === 'propane' ? 'propane' : 'natural-gas';
      const fromModel = spec?.fuels[gasFuel];
      const result = checkGasPressure(
        { fuel: gasFuel, ...reading.values },
        fromModel ?? TYPICAL_SPEC[gasFuel],
        fromModel ? 'model' : 'typical',
      );
      return { result, verdict: worst(result.items.map((i) => i.verdict)) };
    }
    case 'temperature-rise': {
      const high = spec?.inputBtuh.high;
      const input = reading.values.stage === 'low' ? (spec?.inputBtuh.low ?? high) : high;
      const efficiency = spec?.afuePct ?? 80;
      const result = input
        ? temperatureRise({
            inputBtuh: input,
            efficiencyPct: efficiency,
            supplyF: reading.values.supplyF,
            returnF: reading.values.returnF,
            riseMinF: spec?.riseRangeF?.min,
            riseMaxF: spec?.riseRangeF?.max,
          })
        : null;
      const riseF = reading.values.supplyF - reading.values.returnF;
      return result
        ? { result, verdict: result.verdict ?? null }
        : {
            result: {
              riseF,
              note: 'No rated input for this unit: the airflow cannot be worked out.',
              source: 'Measured supply minus return.',
              cautions: [],
            },
            verdict: null,
          };
    }
    case 'firing-rate': {
      const result = firingRate({ ...reading.values, ratedInputBtuh: spec?.inputBtuh.high });
      return { result, verdict: result.verdict ?? null };
    }
    case 'co-air-free': {
      return { result: coAirFree(reading.values), verdict: null };
    }
  }
}

const LABEL: Record<ReadingCreate['kind'], string> = {
  'gas-pressure': 'Gas pressure',
  'temperature-rise': 'Temperature rise',
  'firing-rate': 'Firing rate (meter clocked)',
  'co-air-free': 'Air-free CO',
};

/** Stores a reading with its check result and posts the result card into the chat, in one transaction. */
export async function addReading(
  ctx: AppContext,
  user: SessionUser,
  ticketId: number,
  input: ReadingCreate,
): Promise<Reading> {
  await loadScope(ctx.db, user, ticketId);
  const ticket = (await findTicket(ctx.db, ticketId))!;
  const model = ticket.equipmentModel ? await findModel(ctx.db, ticket.equipmentModel.id) : undefined;
  const parsedSpec = equipmentSpecSchema.safeParse(model?.spec);
  const { result, verdict } = judge(input, ticket.fuel, parsedSpec.success ? parsedSpec.data : null);
  const body = `${LABEL[input.kind]}: ${verdict === null ? 'recorded' : verdict === 'ok' ? 'within spec' : `${verdict} — see the result`}`;

  const { readingId, messageId } = await ctx.db.transaction(async (tx) => {
    const id = await repo.insertReading(tx, {
      ticketId,
      authorId: user.id,
      kind: input.kind,
      values: input.values as Record<string, unknown>,
      result: result as unknown as Record<string, unknown>,
      verdict,
    });
    const message = await insertMessageOnce(tx, {
      ticketId,
      authorId: user.id,
      kind: 'event',
      body,
      clientId: `reading-${id}-${randomUUID().slice(0, 8)}`,
      data: { type: 'reading', readingId: id, kind: input.kind, verdict, result },
    });
    await repo.linkMessage(tx, id, message.id);
    return { readingId: id, messageId: message.id };
  });
  const message = (await findMessage(ctx.db, messageId)) as Message;
  void fanOut(ctx, message, user, false);
  return (await repo.findReading(ctx.db, readingId))!;
}

export async function listReadings(ctx: AppContext, user: SessionUser, ticketId: number) {
  await loadScope(ctx.db, user, ticketId);
  return repo.listReadings(ctx.db, ticketId);
}
