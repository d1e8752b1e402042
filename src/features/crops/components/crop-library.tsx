import { CONFIDENCE_WORDS, PARAM_GROUPS } from '#shared/crops/params';
import type { CropDto, CropParamDto } from '#shared/schemas/crops';
import type { DisplayUnit } from '#shared/schemas/gardens';
import { cToF, cDaysToFDays } from '#shared/thermal/units';

const ENUM_WORDS: Record<string, string> = {
  cool: 'Cool-season',
  warm: 'Warm-season',
  'very-hardy': 'Very hardy',
  'frost-tolerant': 'Frost tolerant',
  tender: 'Tender',
  'warm-loving': 'Warm-loving',
  'single-sine': 'Single sine',
  'single-triangle': 'Single triangle',
  'double-sine': 'Double sine',
  'double-triangle': 'Double triangle',
  average: 'Average',
  'clamped-average': 'Clamped average',
  horizontal: 'Horizontal',
  vertical: 'Vertical',
  intermediate: 'Intermediate',
};

const round1 = (n: number) => String(Math.round(n * 10) / 10);

/** Every figure with its unit, temperatures in the garden's display unit. */
export function formatParam(p: Pick<CropParamDto, 'value' | 'unit' | 'kind'>, units: DisplayUnit): string {
  if (p.value === null) return 'Not set';
  if (p.kind === 'boolean') return p.value ? 'Yes' : 'No';
  if (p.kind === 'enum') return ENUM_WORDS[String(p.value)] ?? String(p.value);
  const n = Number(p.value);
  switch (p.unit) {
    case 'C':
      return units === 'F' ? `${round1(cToF(n))} °F` : `${round1(n)} °C`;
    case 'C-days':
      return units === 'F' ? `${round1(cDaysToFDays(n))} °F-days` : `${round1(n)} °C-days`;
    case 'h':
      return `${round1(n)} h`;
    case 'cm':
      return `${round1(n)} cm`;
    default:
      return `${round1(n)} ${p.unit}`;
  }
}

function Param({ p, units }: { p: CropParamDto; units: DisplayUnit }) {
  return (
    <div className="grid gap-1 border-b border-line py-2 sm:grid-cols-[14rem_8rem_1fr] sm:gap-3">
      <dt className="font-semibold">{p.label}</dt>
      <dd className="tabular-nums">
        {formatParam(p, units)}
        {p.origin === 'garden' && <span className="ml-1 text-sm font-semibold text-frost">(this garden)</span>}
      </dd>
      <dd className="text-sm text-loam-soft">
        <span className="font-semibold text-loam">Source:</span> {p.source}
        {p.confidence && (
          <>
            {' '}
            · <abbr title={CONFIDENCE_WORDS[p.confidence]}>{CONFIDENCE_WORDS[p.confidence].split(':')[0]}</abbr>
          </>
        )}
        {p.libraryDefault && <> · Library default: {formatParam({ ...p, value: p.libraryDefault.value }, units)} ({p.libraryDefault.source})</>}
      </dd>
    </div>
  );
}

export function CropLibrary({ crops, units }: { crops: CropDto[]; units: DisplayUnit }) {
  return (
    <ul className="flex flex-col gap-3">
      {crops.map((crop) => {
        const base = crop.params.find((p) => p.key === 'baseC')!;
        const upper = crop.params.find((p) => p.key === 'upperC')!;
        return (
          <li key={crop.key} className="rounded-lg border border-line bg-paper-raised">
            <details>
              <summary className="flex min-h-11 cursor-pointer flex-wrap items-baseline gap-x-3 px-4 py-3">
                <span className="text-lg font-bold">{crop.name}</span>
                <span className="italic text-loam-soft">{crop.botanicalName}</span>
                <span className="text-sm">
                  {ENUM_WORDS[crop.season]} · base {formatParam(base, units)}
                  {upper.value !== null && ` · upper ${formatParam(upper, units)}`}
                  {crop.overrides > 0 && ` · ${crop.overrides} value${crop.overrides === 1 ? '' : 's'} set for this garden`}
                </span>
              </summary>
              <div className="px-4 pb-4">
                {PARAM_GROUPS.map((g) => (
                  <section key={g} aria-label={g}>
                    <h3 className="mt-3 font-bold">{g}</h3>
                    <dl>
                      {crop.params.filter((p) => p.group === g).map((p) => (
                        <Param key={p.key} p={p} units={units} />
                      ))}
                    </dl>
                  </section>
                ))}
              </div>
            </details>
          </li>
        );
      })}
    </ul>
  );
}
