import { createHmac } from 'node:crypto';
import type { AppConfig } from '../../config';
import { loadConfig } from '../../config';

export interface MailSettings {
  appUrl: string;
  /** Signs unsubscribe links; derived so the session secret itself never signs anything else. */
  unsubscribeKey: Buffer;
}

let current: MailSettings | null = null;

/**
 * enqueueAlertMail(transaction, gardenId, alertIds) is called from inside other modules'
 * transactions with no config at hand, so createApp records the settings here once.
 */
export function configureMail(config: Pick<AppConfig, 'sessionSecret' | 'mail'>): void {
  current = {
    appUrl: config.mail.appUrl,
    unsubscribeKey: createHmac('sha256', config.sessionSecret).update('heatclock unsubscribe links v1').digest(),
  };
}

export function mailSettings(): MailSettings {
  if (!current) configureMail(loadConfig());
  return current!;
}
