import type { GardenUpdateInput } from '#shared/schemas/gardens';
import { Garden, Membership } from '../../db/models';
import { AppError } from '../../errors';

export async function listGardensFor(userId: number) {
  const rows = await Membership.findAll({
    where: { userId },
    include: [{ model: Garden, as: 'garden', required: true }],
    order: [[{ model: Garden, as: 'garden' }, 'name', 'ASC']],
  });
  return rows.map((m) => ({ garden: (m as Membership & { garden: Garden }).garden, role: m.role }));
}

export async function getGarden(gardenId: number) {
  const garden = await Garden.findByPk(gardenId);
  if (!garden) throw AppError.notFound('That garden');
  return garden;
}

export async function updateGarden(gardenId: number, input: GardenUpdateInput) {
  const garden = await getGarden(gardenId);
  await garden.update(input);
  return garden;
}
