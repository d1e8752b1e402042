/**
 * The plain words of the trail's summaries: what a field is called where a grower reads it, and
 * one sentence per change ("Changed the sowing date of Copperleaf Butterhead in North 2").
 */
import { CROP_PARAMS } from '#shared/crops/params';
import type { AuditChanges } from './audit';

const FIELD_WORDS: Record<string, string> = {
  bed: 'bed',
  variety: 'variety',
  seedLot: 'seed lot',
  method: 'method',
  status: 'status',
  quantity: 'quantity',
  quantityUnit: 'quantity unit',
  sownOn: 'sowing date',
  plantingsCreated: 'plantings added',
  plantingsUpdated: 'plantings changed',
  logEntriesCreated: 'log entries added',
  emergedOn: 'emergence date',
  thinnedOn: 'thinning date',
  transplantedOn: 'transplant date',
  firstHarvestOn: 'first harvest date',
  lastHarvestOn: 'last harvest date',
  boltedOn: 'bolting date',
  notes: 'notes',
  name: 'name',
  cropKey: 'crop',
  dtmDays: 'days to maturity',
  dtmFrom: 'days counted from',
  emergenceDaysMin: 'shortest emergence',
  emergenceDaysMax: 'longest emergence',
  boltTolerance: 'bolting tolerance',
  heatTolerance: 'heat tolerance',
  traits: 'traits',
  containerFriendly: 'fit for containers',
  sunHours: 'sun hours',
  waterCmPerWeek: 'water per week',
  sowDepthCm: 'sowing depth',
  spacingCm: 'spacing',
  thinSpacingCm: 'spacing after thinning',
  gddTargetOverrideC: 'heat target',
  supplier: 'supplier',
  lotNumber: 'lot number',
  packedForYear: 'packed-for year',
  storageNotes: 'storage notes',
  kind: 'kind',
  lengthM: 'length',
  widthM: 'width',
  latitude: 'latitude',
  longitude: 'longitude',
  elevationM: 'elevation',
  timeZone: 'time zone',
  units: 'temperature units',
  lastSpringFrost50: 'last spring frost',
  firstFallFrost50: 'first autumn frost',
  zone: 'hardiness zone',
  file: 'file',
  firstDay: 'first day',
  lastDay: 'last day',
  daysAdded: 'days added',
  daysChanged: 'days changed',
  testedOn: 'test date',
  seedsTested: 'seeds tested',
  germinated: 'seeds that came up',
  readOn: 'reading date',
  soilC: 'soil temperature',
  depthCm: 'depth',
  note: 'note',
};

const cropParamWord = (field: string): string | undefined =>
  Object.hasOwn(CROP_PARAMS, field) ? CROP_PARAMS[field as keyof typeof CROP_PARAMS].label.toLowerCase() : undefined;

/** The word for one field of an entry; a field without one reads as itself. Crop settings use the crop library's labels. */
export function fieldWord(field: string, entity?: string): string {
  const own = Object.hasOwn(FIELD_WORDS, field) ? FIELD_WORDS[field] : undefined;
  return (entity === 'crop-settings' ? (cropParamWord(field) ?? own) : (own ?? cropParamWord(field))) ?? field;
}

/** "the sowing date", "the sowing date and notes", or "4 details" for more than two fields. */
export function changedWords(changes: AuditChanges, entity?: string): string {
  const words = Object.keys(changes).map((f) => fieldWord(f, entity));
  if (words.length === 0) return 'nothing';
  if (words.length === 1) return `the ${words[0]}`;
  if (words.length === 2) return `the ${words[0]} and ${words[1]}`;
  return `${words.length} details`;
}

/** "Changed the sowing date of Copperleaf Butterhead in North 2". */
export function changedSummary(changes: AuditChanges, subject: string, entity?: string): string {
  return `Changed ${changedWords(changes, entity)} of ${subject}`;
}
