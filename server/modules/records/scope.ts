import type { Transaction } from 'sequelize';
import { Bed, SeedLot, Variety } from '../../db/models';
import { AppError } from '../../errors';

/**
 * References named in a body must belong to the same garden: a record of another garden is
 * reported exactly like a record that does not exist, so ids of other gardens leak nothing.
 */
function missing(field: string, what: string): AppError {
  return new AppError(400, 'validation_failed', `Please check the fields: ${field}.`, { [field]: `No such ${what} in this garden.` });
}

export async function bedInGarden(gardenId: number, bedId: number, transaction?: Transaction, field = 'bedId') {
  const bed = await Bed.findOne({ where: { id: bedId, gardenId }, transaction });
  if (!bed) throw missing(field, 'bed');
  return bed;
}

export async function varietyInGarden(gardenId: number, varietyId: number, transaction?: Transaction, field = 'varietyId') {
  const variety = await Variety.findOne({ where: { id: varietyId, gardenId }, transaction });
  if (!variety) throw missing(field, 'variety');
  return variety;
}

export async function seedLotInGarden(gardenId: number, seedLotId: number, transaction?: Transaction, field = 'seedLotId') {
  const lot = await SeedLot.findOne({ where: { id: seedLotId, gardenId }, transaction });
  if (!lot) throw missing(field, 'seed lot');
  return lot;
}
