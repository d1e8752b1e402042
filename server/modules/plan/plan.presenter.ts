/**
 * A computed plan in words: each start day's reason, the recommended windows and the stretches
 * left out (named by the part of the garden's own year, hemisphere-aware), and a succession.
 * Dates in words are date tokens (shared/format/dates.ts), worded for each reader on the way out.
 */
import { addDays, daysBetween, parseIsoDate } from '#shared/thermal/dates';
import { isSouthern } from '#shared/thermal/season';
import { dayToken, rangeToken } from '#shared/format/dates';
import { countOf } from '#shared/format/count-words';
import type { PlanCandidateDto, PlanDto, PlanExcludedDto, PlanSuccessionDto, PlanWindowDto } from '#shared/schemas/plan';
import { BOLT_SHARE_LIMIT, CANDIDATE_STEP_DAYS, HARDINESS_START_OFFSET_DAYS } from './plan.service';
import type { FailKind, JudgedCandidate, PlanComputation } from './plan.service';

const PARTS = ['winter', 'spring', 'summer', 'autumn'] as const;

/** "early spring", "midsummer", "late autumn": meteorological seasons, six months on south of the equator. */
export function partOfYear(date: string, latitude: number): string {
  const month = parseIsoDate(date).month;
  const shifted = ((month - 1 + (isSouthern(latitude) ? 6 : 0)) % 12) + 1;
  const part = PARTS[Math.floor((shifted % 12) / 3)];
  const place = shifted % 3;
  return place === 0 ? `early ${part}` : place === 1 ? `mid${part}` : `late ${part}`;
}

function capital(s: string): string {
  return s.charAt(0).toUpperCase() + s.slice(1);
}

function yearsOf(share: number, years: number): string {
  return `${Math.round(share * years)} of ${countOf(years, 'past year')}`;
}

function candidateReason(c: JudgedCandidate, plan: PlanComputation): string {
  const { sweep } = c;
  const start = plan.startKind === 'transplant' ? 'Set out' : 'Sown';
  if (c.fail === 'data') return 'Too few past years with complete weather for this start day.';
  const ready = sweep.maturity.p10 && sweep.maturity.p90 ? `ready ${rangeToken(sweep.maturity.p10, sweep.maturity.p90)}` : 'not ready in every year';
  const head = `${start} ${dayToken(c.sowOn)}: ${ready} in ${countOf(sweep.analogYears, 'past year')}`;
  switch (c.fail) {
    case 'early':
      return plan.hardiness === 'warm-loving'
        ? `${head}, but less than a week after the last spring frost (${dayToken(plan.frost.lastSpring!)} at this risk); a warm-loving crop needs settled warmth.`
        : plan.tender
        ? `${head}, but not after the last spring frost (${dayToken(plan.frost.lastSpring!)} at this risk); a frost-tender crop needs frost-free days.`
        : `${head}, but earlier than ${plan.cropName.toLowerCase()} is usually started before the last spring frost (${dayToken(plan.frost.lastSpring!)} at this risk).`;
    case 'autumn':
      return c.afterFrost
        ? `${head}, but after the first autumn frost (${dayToken(plan.frost.firstFall!)} at this risk).`
        : `${head}, but not ready before the first autumn frost (${dayToken(plan.frost.firstFall!)}) in ${yearsOf(sweep.missCutoffShare, sweep.analogYears)}.`;
    case 'bolt':
      return `${head}, but high bolt risk while ready to pick in ${yearsOf(sweep.highBoltShare, sweep.analogYears)}.`;
    default:
      return `${head}; high bolt risk at harvest in ${yearsOf(sweep.highBoltShare, sweep.analogYears)}.`;
  }
}

interface Run {
  items: JudgedCandidate[];
  fail: FailKind | null;
}

function runs(candidates: JudgedCandidate[], same: (a: JudgedCandidate, b: JudgedCandidate) => boolean): Run[] {
  const out: Run[] = [];
  for (const c of candidates) {
    const last = out.at(-1);
    if (last && same(last.items.at(-1)!, c)) last.items.push(c);
    else out.push({ items: [c], fail: c.fail });
  }
  return out;
}

/** Midsummer day of the planned season: 21 Jun north, 21 Dec south. */
function midsummerOf(plan: PlanComputation, latitude: number): string {
  return isSouthern(latitude) ? `${plan.season.startYear}-12-21` : `${plan.season.startYear}-06-21`;
}

function windowName(run: Run, plan: PlanComputation, latitude: number): string {
  const mid = midsummerOf(plan, latitude);
  const from = run.items[0].sowOn;
  const to = run.items.at(-1)!.sowOn;
  return to < mid ? 'spring' : from > mid ? 'autumn' : 'summer';
}

function stretchName(run: Run, latitude: number): string {
  const a = partOfYear(run.items[0].sowOn, latitude);
  const b = partOfYear(run.items.at(-1)!.sowOn, latitude);
  return a === b ? a : `${a} to ${b}`;
}

function worst(run: Run, pick: (c: JudgedCandidate) => number): JudgedCandidate {
  return run.items.reduce((w, c) => (pick(c) > pick(w) ? c : w));
}

function excludedReason(run: Run, plan: PlanComputation, name: string, range: string): string {
  const head = `${capital(name)} (${range})`;
  switch (run.fail) {
    case 'early':
      return plan.hardiness === 'warm-loving'
        ? `${head}: less than a week after the last spring frost, ${dayToken(plan.frost.lastSpring!)} at this risk.`
        : plan.tender
        ? `${head}: not after the last spring frost, ${dayToken(plan.frost.lastSpring!)} at this risk.`
        : `${head}: earlier than ${countOf(Math.abs(HARDINESS_START_OFFSET_DAYS[plan.hardiness]) / 7, 'week')} before the last spring frost (${dayToken(plan.frost.lastSpring!)} at this risk).`;
    case 'autumn': {
      const c = worst(run, (x) => x.sweep.missCutoffShare);
      return run.items.every((x) => x.afterFrost)
        ? `${head}: after the first autumn frost, ${dayToken(plan.frost.firstFall!)} at this risk.`
        : `${head}: not ready before the first autumn frost (${dayToken(plan.frost.firstFall!)}) in ${yearsOf(c.sweep.missCutoffShare, c.sweep.analogYears)}.`;
    }
    case 'bolt': {
      const c = worst(run, (x) => x.sweep.highBoltShare);
      return `${head}: high bolt risk while ready to pick in ${yearsOf(c.sweep.highBoltShare, c.sweep.analogYears)}.`;
    }
    default:
      return `${head}: too few past years with complete weather.`;
  }
}

/** Spacing between sowings: the spread of ready days across past years, in whole weeks, 1–4 (common practice, no source). */
export function successionSpacing(items: JudgedCandidate[]): number {
  const widths = items
    .map((c) => (c.sweep.maturityDays.p10 !== null && c.sweep.maturityDays.p90 !== null ? c.sweep.maturityDays.p90 - c.sweep.maturityDays.p10 : null))
    .filter((x): x is number => x !== null)
    .sort((a, b) => a - b);
  const median = widths.length ? widths[Math.floor(widths.length / 2)] : 0;
  return CANDIDATE_STEP_DAYS * Math.min(4, Math.max(1, Math.round(median / CANDIDATE_STEP_DAYS)));
}

function succession(good: Run[], plan: PlanComputation): PlanSuccessionDto | null {
  const longest = good.reduce<Run | null>((l, r) => (!l || r.items.length > l.items.length ? r : l), null);
  if (!longest) return null;
  const everyDays = successionSpacing(longest.items);
  const from = longest.items[0].sowOn;
  const last = longest.items.at(-1)!.sowOn;
  // At least three sowings make a succession (common practice, no source).
  if (daysBetween(from, last) < 2 * everyDays) return null;
  const to = addDays(from, Math.floor(daysBetween(from, last) / everyDays) * everyDays);
  const sowings = daysBetween(from, to) / everyDays + 1;
  const verb = plan.startKind === 'transplant' ? 'set out plants' : 'sow';
  return {
    everyDays,
    from,
    to,
    words: `For a steady harvest, ${verb} every ${countOf(everyDays, 'day')} from ${dayToken(from)} to ${dayToken(to)} (${countOf(sowings, plan.startKind === 'transplant' ? 'planting' : 'sowing')}). The spacing follows how far ready days spread across past years, in whole weeks (a rule of thumb).`,
  };
}

export function presentPlan(plan: PlanComputation): PlanDto {
  const latitude = plan.garden.latitude ?? 0;
  const candidates: PlanCandidateDto[] = plan.candidates.map((c) => ({
    sowOn: c.sowOn,
    harvest: { ...c.sweep.maturity },
    boltHighShare: c.sweep.highBoltShare,
    frostOk: c.frostOk,
    years: c.sweep.analogYears,
    recommended: c.fail === null,
    reason: candidateReason(c, plan),
  }));
  const all = runs(plan.candidates, (a, b) => a.fail === b.fail);
  const good = all.filter((r) => r.fail === null);
  const names = good.map((r) => windowName(r, plan, latitude));
  const windows: PlanWindowDto[] = good.map((r, i) => {
    const repeated = names.filter((n) => n === names[i]).length > 1;
    const name = `${repeated ? `${partOfYear(r.items[0].sowOn, latitude)} ` : ''}${repeated ? '' : names[i]} window`.replace(/\s+/gu, ' ');
    const first = r.items[0];
    const last = r.items.at(-1)!;
    const maxBolt = worst(r, (x) => x.sweep.highBoltShare);
    const harvestFrom = first.sweep.maturity.p50!;
    const harvestTo = last.sweep.maturity.p50!;
    const bolt = maxBolt.sweep.highBoltShare > 0 ? `high bolt risk at harvest in at most ${yearsOf(maxBolt.sweep.highBoltShare, maxBolt.sweep.analogYears)}` : 'no high bolt risk at harvest in past years';
    const frost = plan.tender && plan.frost.lastSpring ? `; after the last spring frost (${dayToken(plan.frost.lastSpring)} at this risk)` : '';
    const verb = plan.startKind === 'transplant' ? 'Set out' : 'Sow';
    return {
      from: first.sowOn,
      to: last.sowOn,
      name: capital(name),
      reason: `${verb} ${rangeToken(first.sowOn, last.sowOn)} to pick from about ${rangeToken(harvestFrom, harvestTo)}: ${bolt}${frost}.`,
    };
  });
  const excluded: PlanExcludedDto[] = all
    .filter((r) => r.fail !== null)
    .map((r) => {
      const name = stretchName(r, latitude);
      const from = r.items[0].sowOn;
      const to = r.items.at(-1)!.sowOn;
      return { from, to, name, reason: excludedReason(r, plan, name, rangeToken(from, to)) };
    });
  const verb = plan.startKind === 'transplant' ? 'set out' : 'sow';
  const summary = plan.missing
    ? `No plan yet: ${plan.missing}`
    : windows.length
      ? `${windows.map((w) => `${w.name}: ${verb} ${rangeToken(w.from, w.to)}`).join('. ')}.`
      : `No start day this season passes the frost and bolt checks at this frost risk.`;
  const risk = Number(plan.frostRisk);
  return {
    variety: { id: plan.variety.id, name: plan.variety.name, cropName: plan.cropName },
    season: { label: plan.season.label, from: plan.season.start, to: plan.season.end },
    frostRisk: plan.frostRisk,
    startKind: plan.startKind,
    tender: plan.tender,
    frost: plan.frost,
    candidates,
    windows,
    excluded,
    succession: plan.missing ? null : succession(good, plan),
    summary,
    method:
      `One start day every ${countOf(CANDIDATE_STEP_DAYS, 'day')} of the ${plan.season.label} season is tried against each of the garden's past years with the variety's heat target. ` +
      `Frost dates are the last spring and first autumn day at or below 0 °C, taken so that ${risk} in 100 past seasons had a frost beyond them, the way freeze probabilities are given in NOAA's climate normals. ` +
      `A start day is recommended when it is not too early for the crop's hardiness class (hardiness classes from Purdue Extension HO-203; how many weeks before the frost is a common rule of thumb, not yet checked against a published table), ready before the first autumn frost in most years, ` +
      `and fewer than ${Math.round(BOLT_SHARE_LIMIT * 100)} % of past years brought high bolt risk into the first week of harvest (a rule of thumb).`,
  };
}
