/**
 * "Garden weather changed" → the garden's progress is recomputed. The processor reloads the
 * garden's plantings and weather itself, so running it twice, or late, gives the same answer;
 * growing plantings are computed at once so Today is warm when the grower opens it, the others
 * on their next read.
 */
import type { Processor } from '../worker';
import type { ProgressService } from '../../modules/progress/progress.service';

export function plantingProgressProcessor(progress: ProgressService): Processor {
  return {
    name: 'planting-progress',
    async handle(event) {
      await progress.repo.invalidate({ gardenId: event.gardenId });
      await progress.refreshGarden(event.gardenId, { status: 'growing' });
    },
  };
}
