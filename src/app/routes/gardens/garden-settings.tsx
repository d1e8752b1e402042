import { Notice } from '@/components/ui/notice';
import { GardenFacts } from '@/features/gardens/components/garden-facts';
import { GardenSettingsForm } from '@/features/gardens/components/garden-settings-form';
import { useCurrentGarden } from '@/app/routes/gardens/garden-layout';
import { NotificationPreferencesSection } from '@/features/notifications/components/notification-preferences-section';
import { FailedMailSection } from '@/features/notifications/components/failed-mail-section';
import { CalendarFeedSection } from '@/features/calendar/components/calendar-feed-section';
import { ClimateFactsSection } from '@/features/climate/components/climate-facts-section';
import { WinterChillSection } from '@/features/chill/components/winter-chill-section';
import { Link } from 'react-router-dom';

export function GardenSettingsPage() {
  const garden = useCurrentGarden();
  const isOwner = garden.role === 'owner';

  return (
    <div className="flex max-w-2xl flex-col gap-6">
      <title>{`Garden settings · ${garden.name} · Heatclock`}</title>
      <h1 className="text-2xl font-bold sm:text-3xl">Garden settings</h1>
      {isOwner ? (
        // Keyed so switching garden starts from that garden's values, not the last one's edits.
        <GardenSettingsForm key={garden.id} garden={garden} />
      ) : (
        <>
          <Notice tone="info" title="Read only">
            Only the garden’s owner can change these settings.
          </Notice>
          <section className="rounded-lg border border-line bg-paper-raised px-4 sm:px-6">
            <GardenFacts garden={garden} showName />
          </section>
        </>
      )}
      {/* Keyed so another garden's override form starts from that garden's figures. */}
      <ClimateFactsSection key={`climate-${garden.id}`} gardenId={garden.id} isOwner={isOwner} />
      {garden.latitude !== null && <WinterChillSection key={`chill-${garden.id}`} gardenId={garden.id} unit={garden.units} />}
      <NotificationPreferencesSection gardenId={garden.id} />
      <CalendarFeedSection />
      {isOwner && <FailedMailSection gardenId={garden.id} />}
      <section aria-labelledby="settings-team" className="rounded-lg border border-line bg-paper-raised p-4 sm:px-6">
        <h2 id="settings-team" className="text-lg font-semibold">
          People
        </h2>
        <ul className="mt-2 space-y-1">
          <li>
            <Link to={`/g/${garden.id}/members`} className="underline underline-offset-2">
              {isOwner ? 'Members: invite people, change roles' : 'Members of this garden'}
            </Link>
          </li>
          {isOwner && (
            <li>
              <Link to={`/g/${garden.id}/audit`} className="underline underline-offset-2">
                Audit trail: who changed which record, and when
              </Link>
            </li>
          )}
        </ul>
      </section>
    </div>
  );
}
