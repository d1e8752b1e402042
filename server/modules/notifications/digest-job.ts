import cron from 'node-cron';
import type { Sequelize } from 'sequelize';
import type { Logger } from '../../lib/logger';
import { enqueueDigests } from './digests';

/**
 * Every hour on the hour (UTC, so every time zone's whole hours line up; zones with a :30 offset
 * get their digest at half past). Several scheduler instances may run it: the per-date dedupe key
 * keeps one digest each. An hour missed while no scheduler ran is not made up.
 */
export function scheduleDigests(sequelize: Sequelize, logger: Logger) {
  return cron.schedule(
    '0 * * * *',
    async () => {
      try {
        const queued = await enqueueDigests(sequelize, new Date());
        if (queued) logger.info('digests queued', { queued });
      } catch (err) {
        logger.error('digests failed', { error: (err as Error).message });
      }
    },
    { timezone: 'UTC', noOverlap: true, name: 'mail-digests' },
  );
}
