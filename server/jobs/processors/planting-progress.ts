/**
 * "Garden weather changed" → the garden's progress is computed again, then its alerts evaluated
 * from it: one step, so alerts never read progress made from the weather before the change. The
 * processor reloads everything by garden id, so running it twice, or late, gives the same answer;
 * growing plantings are computed at once so Today is warm when the grower opens it, the others
 * on their next read.
 */
import type { Processor } from '../worker';
import type { ProgressService } from '../../modules/progress/progress.service';
import type { AlertService } from '../../modules/alerts/alerts.service';

export function plantingProgressProcessor(progress: ProgressService, alerts: AlertService): Processor {
  return {
    name: 'planting-progress',
    async handle(event) {
      await progress.repo.invalidate({ gardenId: event.gardenId });
      await progress.refreshGarden(event.gardenId, { status: 'growing' });
      await alerts.evaluate(event.gardenId, { progressFresh: true });
    },
  };
}
