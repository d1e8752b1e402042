import { useId, useState } from 'react';
import { useForm } from 'react-hook-form';
import type { PhotoDto } from '#shared/schemas/plantings';
import { ApiError, isNetworkError } from '@/lib/api-client';
import { PhotoTooLargeError, enqueue, useQueuedItems } from '@/lib/offline-queue';
import { mutationProblem } from '@/lib/problems';
import { useSubmissionKey } from '@/lib/use-submission-key';
import { ConfirmDelete } from '@/components/ui/confirm-delete';
import { Loading } from '@/components/ui/loading';
import { Notice } from '@/components/ui/notice';
import { FieldError } from '@/components/ui/text-field';
import { FILE_INPUT_CLASS, UploadButton } from '@/components/ui/upload-button';
import { usePhotos } from '@/features/plantings/api/get-photos';
import { useUploadPhoto } from '@/features/plantings/api/upload-photo';
import { useDeletePhoto } from '@/features/plantings/api/delete-photo';
import { formatFullDate } from '@/lib/format';
import { CONTROL } from '@/features/plantings/components/field-styles';

function Photo({ gardenId, photo: p, canEdit }: { gardenId: number; photo: PhotoDto; canEdit: boolean }) {
  const remove = useDeletePhoto(gardenId, p.plantingId, p.id);
  return (
    <li className="flex flex-col gap-1">
      <figure>
        <img src={p.url} alt={p.caption || `Photo of ${formatFullDate(p.takenOn)}`} width={p.width} height={p.height} loading="lazy" className="h-auto w-full rounded-md border border-line" />
        <figcaption className="text-sm">
          {formatFullDate(p.takenOn)}
          {p.caption && ` · ${p.caption}`}
        </figcaption>
      </figure>
      {canEdit && (
        <ConfirmDelete
          compact
          label={`Delete the photo of ${formatFullDate(p.takenOn)}`}
          question="Delete this photo?"
          consequence="The picture and its entry in the log are removed for good."
          confirmLabel="Delete photo"
          onConfirm={() => remove.mutate()}
          pending={remove.isPending}
          error={remove.error}
        />
      )}
    </li>
  );
}

const PHOTO_TYPES = ['image/jpeg', 'image/png', 'image/webp'];

interface PhotoValues {
  file: FileList | null;
  caption: string;
}

function checkPhoto(files: FileList | null): true | string {
  const file = files?.[0];
  if (!file) return 'Choose a photo to add.';
  if (!PHOTO_TYPES.includes(file.type)) return 'Choose a JPEG, PNG or WebP picture.';
  return true;
}

/** The picker looks and behaves like the station upload: the same file field and button, cleared once a photo is saved. */
function PhotoUploadForm({ gardenId, plantingId, plantingName, today }: { gardenId: number; plantingId: number; plantingName: string; today: string }) {
  const id = useId();
  const upload = useUploadPhoto(gardenId, plantingId);
  // With no signal the photo waits on this device (src/lib/offline-queue.ts) under the same key.
  // Kept on the device, or why it could not be (too large to keep).
  const [queued, setQueued] = useState<{ waiting: true } | { waiting: false; why: string } | null>(null);
  const submission = useSubmissionKey();
  const {
    register,
    handleSubmit,
    reset,
    formState: { errors, isSubmitting },
  } = useForm<PhotoValues>({ defaultValues: { file: null, caption: '' } });

  // Returned to the form, so it counts as submitting (and the button stays off) until the answer.
  const onSubmit = handleSubmit((values, event) => {
    const file = values.file?.[0];
    if (!file) return;
    const form = event?.target instanceof HTMLFormElement ? event.target : null;
    const caption = values.caption.trim();
    const idempotencyKey = submission.keyFor({ name: file.name, size: file.size, lastModified: file.lastModified, type: file.type, caption });
    const cleared = () => {
      submission.renew();
      // The native reset empties the file picker itself; the form's state follows.
      form?.reset();
      reset();
    };
    setQueued(null);
    return upload.mutateAsync({ file, caption, idempotencyKey, takenOn: today }).then(cleared, (e: unknown) => {
      // Any other refusal is shown from the mutation's own error below.
      if (!isNetworkError(e)) return;
      return enqueue({ id: idempotencyKey, kind: 'photo', gardenId, plantingId, plantingName, idempotencyKey, photo: file, caption, takenOn: today }).then(
        () => {
          upload.reset();
          setQueued({ waiting: true });
          cleared();
        },
        // A device that cannot keep it (no storage) leaves the upload's own error showing.
        (err: unknown) => setQueued(err instanceof PhotoTooLargeError ? { waiting: false, why: err.message } : null),
      );
    });
  });

  const serverFields = upload.error instanceof ApiError ? upload.error.fields : {};
  const fileError = errors.file?.message ?? serverFields.photo;
  const captionError = errors.caption?.message ?? serverFields.caption;

  return (
    <form onSubmit={onSubmit} noValidate aria-label="Add a photo" className="flex flex-col gap-4">
      <div className="flex flex-col gap-1">
        <label htmlFor={`${id}-file`} className="font-semibold">
          Photo
        </label>
        <input
          id={`${id}-file`}
          type="file"
          accept={PHOTO_TYPES.join(',')}
          capture="environment"
          aria-invalid={fileError ? true : undefined}
          aria-describedby={[`${id}-privacy`, fileError ? `${id}-file-error` : null].filter(Boolean).join(' ')}
          className={FILE_INPUT_CLASS}
          {...register('file', { validate: checkPhoto })}
        />
        {fileError && <FieldError id={`${id}-file-error`}>{fileError}</FieldError>}
      </div>
      <div className="flex flex-col gap-1">
        <label htmlFor={`${id}-caption`} className="font-semibold">
          Caption (optional)
        </label>
        <input
          id={`${id}-caption`}
          aria-invalid={captionError ? true : undefined}
          aria-describedby={captionError ? `${id}-caption-error` : undefined}
          className={`${CONTROL} max-w-md`}
          {...register('caption', { maxLength: { value: 300, message: 'The caption must be at most 300 characters.' } })}
        />
        {captionError && <FieldError id={`${id}-caption-error`}>{captionError}</FieldError>}
      </div>
      <div>
        <UploadButton pending={isSubmitting || upload.isPending} label="Add photo" pendingLabel="Uploading…" />
      </div>
      <p id={`${id}-privacy`} className="text-sm text-loam-soft">
        Location and camera details are removed from photos when they are saved.
      </p>
      {upload.isSuccess && (
        <Notice tone="success" title="Photo added" live="status">
          It is in the photos above and in the planting’s log.
        </Notice>
      )}
      {queued?.waiting && (
        <Notice tone="success" title="Photo waiting to send" live="status">
          No signal: the photo is saved on this device and is sent when the connection returns.
        </Notice>
      )}
      {upload.isError && (
        <Notice tone="error" title="The photo was not added" live="alert">
          {mutationProblem(upload.error, 'the chosen photo is kept')}
          {queued && !queued.waiting && ` ${queued.why}`}
        </Notice>
      )}
    </form>
  );
}

/** Photos taken with no signal, kept on this device until Heatclock has them. */
function WaitingPhotos({ gardenId, plantingId }: { gardenId: number; plantingId: number }) {
  const items = useQueuedItems().filter((i) => i.kind === 'photo' && i.gardenId === gardenId && i.plantingId === plantingId && (i.status === 'waiting' || i.status === 'sending'));
  if (!items.length) return null;
  return (
    <p role="status" className="rounded-md border border-dashed border-loam-soft bg-paper px-3 py-2 text-sm">
      {items.length === 1 ? '1 photo is' : `${items.length} photos are`} waiting to send from this device.
    </p>
  );
}

export function PlantingPhotos({ gardenId, plantingId, plantingName, canEdit, today }: { gardenId: number; plantingId: number; plantingName: string; canEdit: boolean; today: string }) {
  const photos = usePhotos(gardenId, plantingId);
  return (
    <div className="flex flex-col gap-3">
      {photos.isPending && <Loading label="Loading photos…" />}
      {photos.isError && <Notice tone="error">{photos.error.message}</Notice>}
      {photos.data && !photos.data.length && <p className="text-loam-soft">No photos yet.</p>}
      {photos.data && photos.data.length > 0 && (
        <ul className="grid grid-cols-2 gap-3 sm:grid-cols-3">
          {photos.data.map((p) => (
            <Photo key={p.id} gardenId={gardenId} photo={p} canEdit={canEdit} />
          ))}
        </ul>
      )}
      <WaitingPhotos gardenId={gardenId} plantingId={plantingId} />
      {canEdit && <PhotoUploadForm gardenId={gardenId} plantingId={plantingId} plantingName={plantingName} today={today} />}
    </div>
  );
}
