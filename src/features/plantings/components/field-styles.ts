/** Native selects and text areas styled like the shell's text fields. */
export const CONTROL =
  'min-h-11 w-full min-w-0 rounded-md border border-line bg-paper-raised px-3 py-2 text-loam aria-[invalid=true]:border-2 aria-[invalid=true]:border-clay';
