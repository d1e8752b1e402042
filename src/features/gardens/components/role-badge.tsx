import { Eye, KeyRound, Sprout } from 'lucide-react';
import type { Role } from '#shared/schemas/gardens';
import { ROLE_WORDS } from '@/lib/format';

const ICONS = { owner: KeyRound, grower: Sprout, viewer: Eye } as const;

export function RoleBadge({ role }: { role: Role }) {
  const Icon = ICONS[role];
  return (
    <span className="inline-flex items-center gap-1.5 rounded-full border border-line bg-paper-sunk px-3 py-1 text-sm font-semibold">
      <Icon className="size-4" aria-hidden="true" />
      <span>
        <span className="sr-only">Your role: </span>
        {ROLE_WORDS[role]}
      </span>
    </span>
  );
}
