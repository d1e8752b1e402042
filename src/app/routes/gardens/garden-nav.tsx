import { useEffect, useId, useRef, useState } from 'react';
import { NavLink, useLocation } from 'react-router-dom';
import type { LucideIcon } from 'lucide-react';
import { BellRing, CalendarDays, CalendarRange, Carrot, ChartScatter, CloudSun, Ellipsis, History, LayoutGrid, Library, Mail, Package, Settings, Sprout, UserRound, Users } from 'lucide-react';
import { SignOutButton } from '@/features/auth/components/sign-out-button';
import { MailboxLink } from '@/features/notifications/components/mailbox-link';
import { AccountLink } from '@/features/account/components/account-link';
import { AlertsNavLink } from '@/features/alerts/components/alerts-nav-link';
import { useGarden } from '@/features/gardens/api/get-garden';

/**
 * Below 768 px a tab with its icon over a short word in the bar pinned to the bottom; from 768 px
 * a plain link in the header's row. Either way at least 44 px each way, the current page underlined.
 */
const TAB =
  'relative flex min-h-14 min-w-11 flex-col items-center justify-center gap-0.5 border-t-4 border-transparent px-1 pb-1 text-[0.8125rem] leading-tight font-semibold text-loam-soft hover:text-loam aria-[current=page]:border-leaf aria-[current=page]:text-loam data-[current=true]:border-leaf data-[current=true]:text-loam md:min-h-11 md:flex-row md:gap-1.5 md:border-t-0 md:border-b-4 md:px-0.5 md:pb-0 md:text-[0.9375rem] md:text-loam lg:px-1 lg:text-base md:hover:border-line md:aria-[current=page]:border-leaf';
const TAB_ICON = 'size-6 md:hidden';

const MENU_LINK =
  'flex min-h-12 items-center gap-3 rounded-md border-l-4 border-transparent px-3 font-semibold text-loam hover:bg-paper-sunk aria-[current=page]:border-leaf aria-[current=page]:bg-leaf-tint';
const MENU_ICON = 'size-5 shrink-0';

/** The pages a phone reaches through "More"; from 768 px they sit in the header row with the rest. */
const MORE_PAGES: ReadonlyArray<{ path: string; label: string; icon: LucideIcon; ownersOnly?: boolean; header?: false }> = [
  { path: 'varieties', label: 'Varieties', icon: Library },
  { path: 'seed-lots', label: 'Seed lots', icon: Package },
  { path: 'beds', label: 'Beds', icon: LayoutGrid },
  { path: 'crops', label: 'Crops', icon: Carrot },
  { path: 'weather', label: 'Weather', icon: CloudSun },
  { path: 'plan', label: 'Plan', icon: CalendarRange },
  { path: 'compare', label: 'Compare', icon: ChartScatter },
  { path: 'settings', label: 'Garden settings', icon: Settings },
  // The header row is full from 768 px: there, Members and the trail are reached from Garden settings.
  { path: 'members', label: 'Members', icon: Users, header: false },
  { path: 'audit', label: 'Audit', icon: History, ownersOnly: true, header: false },
];

/** The garden's role comes from the layout's own garden query (same key, no second request). */
function usePagesFor(gardenId: number) {
  const role = useGarden(gardenId).data?.role;
  return MORE_PAGES.filter((page) => !page.ownersOnly || role === 'owner');
}

export function GardenNav({ gardenId, userName }: { gardenId: number; userName: string | undefined }) {
  const base = `/g/${gardenId}`;
  const pages = usePagesFor(gardenId);
  return (
    <nav
      aria-label="Garden"
      className="fixed inset-x-0 bottom-0 z-30 border-t border-line bg-paper-sunk pb-[env(safe-area-inset-bottom)] md:static md:border-t-0 md:bg-transparent md:pb-0"
    >
      <ul className="grid grid-cols-4 md:mx-auto md:flex md:max-w-5xl md:flex-nowrap md:gap-x-3 md:overflow-x-auto md:px-4 lg:gap-x-5">
        <li>
          <NavLink end to={base} className={TAB}>
            <CalendarDays className={TAB_ICON} aria-hidden />
            <span>Today</span>
          </NavLink>
        </li>
        <li>
          <NavLink to={`${base}/plantings`} className={TAB}>
            <Sprout className={TAB_ICON} aria-hidden />
            <span>Plantings</span>
          </NavLink>
        </li>
        <li>
          <AlertsNavLink gardenId={gardenId} className={TAB} icon={<BellRing className={TAB_ICON} aria-hidden />} />
        </li>
        {pages
          .filter((page) => page.header !== false)
          .map((page) => (
            <li key={page.path} className="hidden md:block">
              <NavLink to={`${base}/${page.path}`} className={TAB}>
                {page.label}
              </NavLink>
            </li>
          ))}
        <li className="md:hidden">
          <MoreMenu base={base} userName={userName} pages={pages} />
        </li>
      </ul>
    </nav>
  );
}

/**
 * A disclosure, not a modal: the button says whether the list is open, the list follows it in
 * reading order, and Escape, a tap elsewhere, leaving it by keyboard or opening a page closes it.
 */
function MoreMenu({ base, userName, pages }: { base: string; userName: string | undefined; pages: typeof MORE_PAGES }) {
  const panelId = useId();
  const { pathname } = useLocation();
  // Remembering where it was opened closes it by itself once another page shows.
  const [openAt, setOpenAt] = useState<string | null>(null);
  const open = openAt === pathname;
  const close = () => setOpenAt(null);
  const wrapper = useRef<HTMLDivElement>(null);
  const button = useRef<HTMLButtonElement>(null);
  const onMorePage = pages.some((page) => pathname.startsWith(`${base}/${page.path}`));

  useEffect(() => {
    if (!open) return;
    const onKey = (event: KeyboardEvent) => {
      if (event.key !== 'Escape') return;
      setOpenAt(null);
      button.current?.focus();
    };
    const onPointer = (event: PointerEvent) => {
      if (!wrapper.current?.contains(event.target as Node)) setOpenAt(null);
    };
    document.addEventListener('keydown', onKey);
    document.addEventListener('pointerdown', onPointer);
    return () => {
      document.removeEventListener('keydown', onKey);
      document.removeEventListener('pointerdown', onPointer);
    };
  }, [open]);

  return (
    <div
      ref={wrapper}
      onBlur={(event) => {
        if (event.relatedTarget && !event.currentTarget.contains(event.relatedTarget)) close();
      }}
    >
      <button
        ref={button}
        type="button"
        aria-expanded={open}
        aria-controls={panelId}
        data-current={onMorePage || open}
        className={`${TAB} w-full`}
        onClick={() => setOpenAt(open ? null : pathname)}
      >
        <Ellipsis className={TAB_ICON} aria-hidden />
        <span>More</span>
        {onMorePage && <span className="sr-only"> (the page you are on is here)</span>}
      </button>
      {open && (
        <div
          id={panelId}
          className="absolute inset-x-0 bottom-full max-h-[calc(100dvh-9rem)] overflow-y-auto border-t border-line bg-paper-raised shadow-[0_-8px_24px_rgb(43_33_24/0.18)]"
        >
          <ul className="grid grid-cols-2 gap-1 p-2">
            {pages.map((page) => (
              <li key={page.path}>
                <NavLink to={`${base}/${page.path}`} className={MENU_LINK} onClick={close}>
                  <page.icon className={MENU_ICON} aria-hidden />
                  {page.label}
                </NavLink>
              </li>
            ))}
          </ul>
          <div className="flex flex-wrap items-center gap-x-2 gap-y-1 border-t border-line px-2 py-2">
            {userName && (
              <p className="w-full px-3 pt-1 text-sm text-loam-soft">
                Signed in as <span className="font-semibold text-loam">{userName}</span>
              </p>
            )}
            <AccountLink className={MENU_LINK} icon={<UserRound className={MENU_ICON} aria-hidden />} />
            <MailboxLink className={MENU_LINK} icon={<Mail className={MENU_ICON} aria-hidden />} />
            <SignOutButton className="ml-auto px-3 text-sm" />
          </div>
        </div>
      )}
    </div>
  );
}
