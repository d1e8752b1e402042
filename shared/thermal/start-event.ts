/**
 * The one rule for where a planting's degree days start and what a packet's days to maturity
 * mean for it. Every caller — the planting presenter, progress, targets, seasons, compare — asks
 * here, so two places can never count the same planting from different days.
 *
 * The start event is the day the plant begins to grow in the garden's own weather:
 *   direct sow      the sowing date;
 *   transplant      the transplant date (bought or gifted plants);
 *   indoor start    the transplant date: days under lights or on a windowsill are not the
 *                   garden's weather, so the count waits for the plant to go out.
 * A planned planting starts on its planned date.
 *
 * Day counting (common practice, no source): the start day is day 0 and adds no degree days;
 * the count runs from the next day, and a planting is ready on the day its total reaches the
 * target. A packet's "55 days" from a 1 May sowing is therefore 25 June, exactly as a grower
 * counts it on a calendar, and a constant-temperature projection lands on that same date.
 */
import { addDays, daysBetween } from './dates';
import { seasonOf } from './season';
import type { Season } from './season';

export type DtmCountsFromPacket = 'sowing' | 'emergence' | 'transplant';

export interface StartEventPlanting {
  method: 'direct-sow' | 'transplant' | 'indoor-start';
  status: 'planned' | 'growing' | 'harvested' | 'bolted' | 'failed';
  sownOn: string | null;
  emergedOn: string | null;
  transplantedOn: string | null;
}

export interface StartEventVariety {
  dtmDays: number | null;
  dtmFrom: DtmCountsFromPacket;
  emergenceDaysMin: number | null;
  emergenceDaysMax: number | null;
}

export interface StartEvent {
  kind: 'sowing' | 'transplant';
  on: string;
  planned: boolean;
  /** Days from the start event to maturity as the packet counts them; null without packet days. */
  packetDays: number | null;
  /** The packet's own date: the start event (or recorded emergence) plus its days; null without packet days. */
  packetDate: string | null;
  /** How the packet's days were read for this planting, in words. */
  explanation: string;
}

export type StartEventResult = { event: StartEvent; reason?: undefined } | { event: null; reason: string };

/** The first day whose degree days count towards a planting started on `start`. */
export function firstCountedDay(start: string): string {
  return addDays(start, 1);
}

/** The packet's days to emergence; the longer figure, which gives the few days' slack practice adds. */
export function packetEmergenceDays(v: StartEventVariety): number | null {
  return v.emergenceDaysMax ?? v.emergenceDaysMin;
}

function eventOf(p: StartEventPlanting): { kind: 'sowing' | 'transplant'; on: string } | null {
  if (p.method === 'direct-sow') return p.sownOn ? { kind: 'sowing', on: p.sownOn } : null;
  return p.transplantedOn ? { kind: 'transplant', on: p.transplantedOn } : null;
}

function packetReading(p: StartEventPlanting, v: StartEventVariety, kind: 'sowing' | 'transplant', on: string) {
  const dtm = v.dtmDays;
  if (dtm === null) return { packetDays: null, packetDate: null, explanation: 'The packet’s days to maturity are not recorded for this variety.' };
  const emergence = packetEmergenceDays(v);
  if (kind === 'sowing') {
    if (v.dtmFrom === 'emergence') {
      const days = dtm + (emergence ?? 0);
      const fromEmergence = p.emergedOn ? addDays(p.emergedOn, dtm) : addDays(on, days);
      return {
        packetDays: days,
        packetDate: fromEmergence,
        explanation:
          emergence === null
            ? `The packet counts ${dtm} days from emergence; with no days to emergence recorded, they are counted from sowing.`
            : `The packet counts ${dtm} days from emergence; ${emergence} days to emergence are added, so ${days} days from sowing.`,
      };
    }
    if (v.dtmFrom === 'transplant') {
      return { packetDays: dtm, packetDate: addDays(on, dtm), explanation: `The packet counts ${dtm} days from transplanting; this planting was sown in place, so it will likely need longer than that from sowing.` };
    }
    return { packetDays: dtm, packetDate: addDays(on, dtm), explanation: `The packet counts ${dtm} days from sowing.` };
  }
  if (v.dtmFrom === 'transplant') {
    return { packetDays: dtm, packetDate: addDays(on, dtm), explanation: `The packet counts ${dtm} days from transplanting.` };
  }
  // A seed-counted packet for a transplanted plant: the days already grown indoors are done.
  const seedDays = dtm + (v.dtmFrom === 'emergence' ? (emergence ?? 0) : 0);
  const indoorDays = p.method === 'indoor-start' && p.sownOn ? Math.max(0, daysBetween(p.sownOn, on)) : 0;
  const days = Math.max(1, seedDays - indoorDays);
  const counted = v.dtmFrom === 'emergence' ? `${dtm} days from emergence (${seedDays} from sowing)` : `${dtm} days from sowing`;
  return {
    packetDays: days,
    packetDate: addDays(on, days),
    explanation: indoorDays
      ? `The packet counts ${counted}; ${indoorDays} of them passed indoors before transplanting, so ${days} days from transplanting.`
      : `The packet counts ${counted}; the plants’ age at transplanting is not recorded, so the full ${days} days are counted from transplanting.`,
  };
}

/** Where this planting's degree days start, or why they cannot start yet. */
export function startEvent(p: StartEventPlanting, v: StartEventVariety): StartEventResult {
  const e = eventOf(p);
  if (!e) {
    if (p.method === 'indoor-start') return { event: null, reason: 'Started indoors and not transplanted yet: degree days count from the day it goes out.' };
    if (p.method === 'transplant') return { event: null, reason: 'No transplant date yet: degree days count from transplanting.' };
    return { event: null, reason: 'No sowing date yet: degree days count from sowing.' };
  }
  return { event: { ...e, planned: p.status === 'planned', ...packetReading(p, v, e.kind, e.on) } };
}

/**
 * The growing season a planting belongs to: the season of its start event, so an indoor start
 * sown in June south of the equator and set out in September belongs to the season it grows in.
 * Without a start event yet (an indoor start still under lights) it has no season: its sowing
 * date could fall in the season that is ending.
 */
export function plantingSeason(p: StartEventPlanting, v: StartEventVariety, latitude: number): Season | null {
  const on = startEvent(p, v).event?.on;
  return on ? seasonOf(on, latitude) : null;
}
