/**
 * "Garden records changed" (a planting, variety, crop or garden edit) → the garden's alerts are
 * evaluated again; the edit already dropped the progress it made stale.
 * Evaluation reloads everything by garden id and upserts by natural key, so a re-run, a late run
 * or two instances at once leave the same alerts and messages.
 */
import type { Processor } from '../worker';
import type { AlertService } from '../../modules/alerts/alerts.service';

export function alertsProcessor(alerts: AlertService): Processor {
  return {
    name: 'alerts',
    async handle(event) {
      await alerts.evaluate(event.gardenId);
    },
  };
}
