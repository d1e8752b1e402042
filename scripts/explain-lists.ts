/**
 * npm run explain:lists — the query plan of every statement the list reads send, against the
 * benchmark database (run `npm run bench:api` once first: it seeds the demo and a garden of 5,000
 * plantings). Each read is run with statement capture on, then each captured SELECT is EXPLAINed.
 * Prints one markdown table per read: table, access type, index used, rows examined, extra.
 */
import { QueryTypes } from 'sequelize';
import { loadConfig } from '../server/config';
import { createSequelize } from '../server/db/sequelize';
import { initModels, Garden, Planting, User } from '../server/db/models';
import { listPlantings } from '../server/modules/plantings/plantings.service';
import { listVarieties } from '../server/modules/varieties/varieties.service';
import { listSeedLots } from '../server/modules/seed-lots/seed-lots.service';
import { ProgressRepository } from '../server/modules/progress/progress.repository';
import { AlertsRepository } from '../server/modules/alerts/alerts.repository';
import { loadGardenWeather } from '../server/modules/weather/garden-weather';
import { plantingListQuerySchema } from '#shared/schemas/plantings';
import { varietyListQuerySchema } from '#shared/schemas/varieties';
import { seedLotListQuerySchema } from '#shared/schemas/seed-lots';
import { addDays } from '#shared/thermal/dates';
import { localDate } from '../server/lib/local-date';
import { ACCESS_COLUMNS, ACCESS_JOINS } from '../server/lib/garden-access';

const DB = process.env.BENCH_DB_NAME ?? 'heatclock_bench';
const base = loadConfig();
const sequelize = createSequelize({ ...base.db, database: DB });
initModels(sequelize);

const captured: string[] = [];
// Sequelize keeps its options on the instance; its typings do not declare them.
const options = (sequelize as unknown as { options: { logging: false | ((sql: string) => void) } }).options;
const capture = (sql: string) => void captured.push(sql.replace(/^Executing \([^)]*\): /, ''));
options.logging = capture;

interface PlanRow { table: string; type: string; key: string | null; rows: number; Extra: string | null }

async function explain(name: string, run: () => Promise<unknown>) {
  captured.length = 0;
  await run();
  const selects = captured.filter((s) => /^\s*SELECT/i.test(s));
  options.logging = false;
  console.log(`\n### ${name}\n`);
  for (const sql of selects) {
    const plan = await sequelize.query<PlanRow>(`EXPLAIN ${sql}`, { type: QueryTypes.SELECT });
    console.log('`' + sql.replace(/\s+/g, ' ').slice(0, 160) + (sql.length > 160 ? '…' : '') + '`\n');
    console.log('| table | type | key | rows | extra |\n|---|---|---|---|---|');
    for (const p of plan) console.log(`| ${p.table} | ${p.type} | ${p.key ?? '—'} | ${p.rows} | ${p.Extra ?? ''} |`);
    console.log();
  }
  options.logging = capture;
}

const big = await Garden.findOne({ where: { name: 'Bench garden with 5000 plantings' } });
if (!big) throw new Error('Run npm run bench:api first: it seeds the 5,000-planting garden.');
const user = await User.findOne({ where: { email: 'grower.rosa@hollowbrook.example' } });
const some = await Planting.findOne({ where: { gardenId: big.id }, order: [['id', 'DESC']] });
const today = localDate(big.timeZone);
const pq = (q: Record<string, unknown>) => plantingListQuerySchema.parse(q);

await explain('Session read (every signed-in request)', () =>
  sequelize.query('SELECT s.data, s.expires, u.id AS userId, u.email, u.name FROM sessions s LEFT JOIN users u ON u.id = s.user_id WHERE s.sid = ? AND s.expires > ?', {
    replacements: ['x'.repeat(32), new Date()],
    type: QueryTypes.SELECT,
  }),
);
await explain('Session read on a garden path, with the member’s access (every garden request)', () =>
  sequelize.query(
    `SELECT s.data, s.expires, u.id AS userId, u.email, u.name, m.user_id AS memberId, ${ACCESS_COLUMNS}
       FROM sessions s LEFT JOIN users u ON u.id = s.user_id LEFT JOIN (memberships m ${ACCESS_JOINS}) ON m.user_id = s.user_id AND m.garden_id = ?
      WHERE s.sid = ? AND s.expires > ?`,
    { replacements: [big.id, 'x'.repeat(32), new Date()], type: QueryTypes.SELECT },
  ),
);
await explain('Garden access check, when the session read could not bring it', () =>
  sequelize.query(
    `SELECT m.role, g.name, g.time_zone AS timeZone, g.units, g.latitude, g.weather_cell_id AS weatherCellId, gr.revision, ae.revision AS alerts
       FROM memberships m JOIN gardens g ON g.id = m.garden_id
       LEFT JOIN garden_revisions gr ON gr.garden_id = m.garden_id LEFT JOIN alert_evaluations ae ON ae.garden_id = m.garden_id
      WHERE m.user_id = ? AND m.garden_id = ?`,
    { replacements: [user!.id, big.id], type: QueryTypes.SELECT },
  ),
);
await explain('Plantings, default order, page 1 of 5,000', () => listPlantings(big.id, pq({})));
await explain('Plantings, page 100 of 5,000', () => listPlantings(big.id, pq({ page: 100 })));
await explain('Plantings, growing, by bed', () => listPlantings(big.id, pq({ status: 'growing', sort: 'bed' })));
await explain('Plantings, one crop, by variety', () => listPlantings(big.id, pq({ crop: 'lettuce', sort: 'variety' })));
await explain('Plantings, sown in a range', () => listPlantings(big.id, pq({ sownFrom: addDays(today, -30), sownTo: today })));
await explain('Plantings, by readiness (stored figure)', () => listPlantings(big.id, pq({ sort: 'ready' })));
await explain('Plantings, text search', () => listPlantings(big.id, pq({ q: 'Row 1' })));
const repo = new ProgressRepository(sequelize);
await explain('Progress summaries of a page', () => repo.summaries(big.id, [some!.id], today));
await explain('Progress of one planting', () => repo.body(big.id, some!.id));
await explain('Stale progress rows', () => repo.stale(big.id, today));
await explain('Today: growing plantings with stored summaries', () => repo.growing(big.id, today));
await explain('Open alerts', () => new AlertsRepository(sequelize).list(big.id, { status: 'open', page: 1, pageSize: 50 } as never));
await explain('Varieties', () => listVarieties(big.id, varietyListQuerySchema.parse({})));
await explain('Seed lots', () => listSeedLots(big.id, seedLotListQuerySchema.parse({})));
await explain('Weather, 45 days', () => loadGardenWeather(sequelize, big, { from: addDays(today, -37), to: addDays(today, 7) }));
await sequelize.close();
