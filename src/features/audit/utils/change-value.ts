import { formatDayMonth, formatFullDate } from '@/lib/format';

const ISO_DAY = /^\d{4}-\d{2}-\d{2}$/;
const MONTH_DAY = /^(\d{2})-(\d{2})$/;

/** Stored units, named after the field that holds them (the trail keeps values as stored). */
function unitOf(field: string): string {
  if (/Cm$|CmPerWeek$/.test(field)) return field.endsWith('PerWeek') ? ' cm a week' : ' cm';
  if (field === 'elevationM' || /^(length|width)M$/.test(field)) return ' m';
  if (field === 'gddTargetOverrideC' || /Gdd$/.test(field)) return ' °C-days';
  if (/C$/.test(field)) return ' °C';
  if (/Hours$|H$/.test(field)) return ' h';
  return '';
}

/** One side of a change in words: a date as a date, yes/no, lists joined, and "not set" where nothing was (for a crop: the library's value). */
export function changeValue(field: string, value: unknown, entity?: string): string {
  if (value === null || value === undefined) return entity === 'crop-settings' ? 'library value' : 'not set';
  if (value === '') return 'empty';
  if (typeof value === 'boolean') return value ? 'yes' : 'no';
  if (Array.isArray(value)) return value.length ? value.map((v) => changeValue(field, v)).join(', ') : 'none';
  if (typeof value === 'number') return `${value}${unitOf(field)}`;
  if (typeof value === 'string') {
    if (ISO_DAY.test(value)) return formatFullDate(value);
    const md = MONTH_DAY.exec(value);
    // Frost dates are month and day only; worded through a year that has 29 February.
    if (md) return formatDayMonth(`2024-${md[1]}-${md[2]}`);
    return value;
  }
  return JSON.stringify(value);
}
