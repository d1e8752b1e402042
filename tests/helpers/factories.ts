import { randomUUID } from 'node:crypto';
import { Garden, Membership, User } from '../../server/db/models';
import { hashPassword } from '../../server/modules/auth/password';
import type { Role } from '#shared/schemas/gardens';
import type { TestAgent } from './test-app';

export const PASSWORD = 'correct horse battery';
let hash: Promise<string> | null = null;

export function uniqueEmail(tag = 'user') {
  return `${tag}-${randomUUID().slice(0, 12)}@test.example`;
}

export async function createUser(attrs: Partial<{ email: string; name: string }> = {}) {
  hash ??= hashPassword(PASSWORD);
  return User.create({ email: attrs.email ?? uniqueEmail(), name: attrs.name ?? 'Test Grower', passwordHash: await hash });
}

export async function createGarden(attrs: Partial<{ name: string; latitude: number; longitude: number; timeZone: string }> = {}) {
  return Garden.create({
    name: attrs.name ?? `Garden ${randomUUID().slice(0, 6)}`,
    latitude: attrs.latitude ?? 45,
    longitude: attrs.longitude ?? -93,
    timeZone: attrs.timeZone ?? 'America/Chicago',
    units: 'F',
  });
}

export async function addMember(userId: number, gardenId: number, role: Role) {
  return Membership.create({ userId, gardenId, role });
}

export async function signIn(agent: TestAgent, email: string, password = PASSWORD) {
  const res = await agent.post('/api/auth/login').send({ email, password });
  if (res.status !== 200) throw new Error(`sign-in failed: ${res.status} ${JSON.stringify(res.body)}`);
  return res;
}

/** A garden with one signed-in member of each role, plus an outsider. */
export async function gardenWithMembers() {
  const garden = await createGarden();
  const owner = await createUser({ name: 'Owner' });
  const grower = await createUser({ name: 'Grower' });
  const viewer = await createUser({ name: 'Viewer' });
  const outsider = await createUser({ name: 'Outsider' });
  await addMember(owner.id, garden.id, 'owner');
  await addMember(grower.id, garden.id, 'grower');
  await addMember(viewer.id, garden.id, 'viewer');
  return { garden, owner, grower, viewer, outsider };
}
