import { FileUp, LoaderCircle } from 'lucide-react';
import { Button } from '@/components/ui/button';

/** The file picker's look in every upload form; a thick clay border marks an invalid choice. */
export const FILE_INPUT_CLASS =
  'w-full max-w-md min-w-0 rounded-md border border-line bg-paper p-1.5 text-sm file:mr-3 file:min-h-9 file:rounded file:border-0 file:bg-paper-sunk file:px-3 file:font-semibold file:text-loam aria-[invalid=true]:border-2 aria-[invalid=true]:border-clay';

/** Submit button of an upload form: says what it does, and shows a spinner with words while sending. */
export function UploadButton({ pending, label, pendingLabel }: { pending: boolean; label: string; pendingLabel: string }) {
  return (
    <Button type="submit" disabled={pending}>
      {pending ? (
        <LoaderCircle className="size-5 animate-spin motion-reduce:animate-none" aria-hidden="true" />
      ) : (
        <FileUp className="size-5" aria-hidden="true" />
      )}
      {pending ? pendingLabel : label}
    </Button>
  );
}
