/**
 * Alerts: what a garden's weather and plantings call for, kept with their history. Figures in
 * `reasons` are worded in the garden's display unit. Calendar dates are 'YYYY-MM-DD'.
 */
import { z } from 'zod';

export const ALERT_TYPES = ['bolt-risk', 'frost', 'heat-stress', 'chilling', 'harvest-window', 'data-gap'] as const;
export type AlertType = (typeof ALERT_TYPES)[number];
export const ALERT_TYPE_WORDS: Record<AlertType, string> = {
  'bolt-risk': 'Bolt risk',
  frost: 'Frost',
  'heat-stress': 'Heat stress',
  chilling: 'Chilling',
  'harvest-window': 'Harvest window',
  'data-gap': 'Weather data gap',
};

export const ALERT_SEVERITIES = ['info', 'watch', 'warning', 'severe'] as const;
export type AlertSeverity = (typeof ALERT_SEVERITIES)[number];
export const ALERT_SEVERITY_WORDS: Record<AlertSeverity, string> = { info: 'For your information', watch: 'Watch', warning: 'Warning', severe: 'Severe' };

export const ALERT_STATUSES = ['open', 'acknowledged', 'resolved'] as const;
export type AlertStatus = (typeof ALERT_STATUSES)[number];

export interface AlertDto {
  id: number;
  gardenId: number;
  type: AlertType;
  severity: AlertSeverity;
  status: AlertStatus;
  /** null for a garden-wide alert (a weather data gap). */
  plantingId: number | null;
  /** "Lettuce: Copperleaf Butterhead (Plot 3)", or the garden's name for a garden-wide alert. */
  subject: string;
  title: string;
  startsOn: string;
  endsOn: string | null;
  /** The figures that raised it, in words with units, e.g. "4 days ≥ 80 °F forecast 9–12 Jun". */
  reasons: string[];
  /** What to do, in plain words. */
  action: string;
  /** The usual safety caution where the work can hurt someone; null otherwise. */
  caution: string | null;
  createdAt: string;
  updatedAt: string;
  acknowledgedAt: string | null;
  acknowledgedBy: string | null;
  resolvedAt: string | null;
}

export const alertListQuerySchema = z.strictObject({
  status: z.enum(ALERT_STATUSES, { error: 'Status must be open, acknowledged or resolved.' }).optional(),
  type: z.enum(ALERT_TYPES, { error: 'Unknown alert type.' }).optional(),
  /** The first so many, in the list's order (most severe first); at most ALERT_LIST_MAX. */
  limit: z.coerce.number({ error: 'Limit must be a whole number.' }).int('Limit must be a whole number.').min(1, 'Limit must be at least 1.').max(500, 'Limit must be at most 500.').optional(),
});

/** The most alerts one list answer holds. */
export const ALERT_LIST_MAX = 500;
export type AlertListQuery = z.infer<typeof alertListQuerySchema>;

/** GET /api/gardens/:gardenId/alerts/counts — for the navigation. */
export interface AlertCountsDto {
  open: number;
  byType: Partial<Record<AlertType, number>>;
}
