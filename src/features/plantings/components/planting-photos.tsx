import { useState } from 'react';
import { ImagePlus } from 'lucide-react';
import type { PhotoDto } from '#shared/schemas/plantings';
import { Button } from '@/components/ui/button';
import { ConfirmDelete } from '@/components/ui/confirm-delete';
import { Loading } from '@/components/ui/loading';
import { Notice } from '@/components/ui/notice';
import { usePhotos } from '@/features/plantings/api/get-photos';
import { useUploadPhoto } from '@/features/plantings/api/upload-photo';
import { useDeletePhoto } from '@/features/plantings/api/delete-photo';
import { formatDay } from '@/features/plantings/components/format-day';
import { CONTROL } from '@/features/plantings/components/field-styles';

function Photo({ gardenId, photo: p, canEdit }: { gardenId: number; photo: PhotoDto; canEdit: boolean }) {
  const remove = useDeletePhoto(gardenId, p.plantingId, p.id);
  return (
    <li className="flex flex-col gap-1">
      <figure>
        <img src={p.url} alt={p.caption || `Photo of ${formatDay(p.takenOn)}`} width={p.width} height={p.height} loading="lazy" className="h-auto w-full rounded-md border border-line" />
        <figcaption className="text-sm">
          {formatDay(p.takenOn)}
          {p.caption && ` · ${p.caption}`}
        </figcaption>
      </figure>
      {canEdit && (
        <ConfirmDelete
          compact
          label={`Delete the photo of ${formatDay(p.takenOn)}`}
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

export function PlantingPhotos({ gardenId, plantingId, canEdit }: { gardenId: number; plantingId: number; canEdit: boolean }) {
  const photos = usePhotos(gardenId, plantingId);
  const upload = useUploadPhoto(gardenId, plantingId);
  const [file, setFile] = useState<File | null>(null);
  const [caption, setCaption] = useState('');

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
      {canEdit && (
        <form
          className="flex flex-col gap-2"
          onSubmit={(e) => {
            e.preventDefault();
            if (file) upload.mutate({ file, caption }, { onSuccess: () => { setFile(null); setCaption(''); e.currentTarget?.reset(); } });
          }}
        >
          <label className="flex flex-col gap-1">
            <span className="font-semibold">Photo</span>
            <input type="file" accept="image/jpeg,image/png,image/webp" capture="environment" onChange={(e) => setFile(e.target.files?.[0] ?? null)} className="min-h-11" />
          </label>
          <label className="flex flex-1 flex-col gap-1">
            <span className="font-semibold">Caption (optional)</span>
            <input value={caption} onChange={(e) => setCaption(e.target.value)} className={CONTROL} />
          </label>
          <Button type="submit" variant="quiet" disabled={!file || upload.isPending}>
            <ImagePlus className="size-5" aria-hidden="true" />
            {upload.isPending ? 'Uploading…' : 'Add photo'}
          </Button>
        </form>
      )}
      {upload.isError && (
        <Notice tone="error" title="The photo was not added" live="alert">
          {upload.error.message}
        </Notice>
      )}
      {canEdit && <p className="text-sm text-loam-soft">Location and camera details are removed from photos when they are saved.</p>}
    </div>
  );
}
