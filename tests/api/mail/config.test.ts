import { describe, expect, it } from 'vitest';
import { loadConfig } from '../../../server/config';

const base = { NODE_ENV: 'test', SESSION_SECRET: 'x'.repeat(32) } as NodeJS.ProcessEnv;

describe('mail settings', () => {
  it('when nothing is set, then mail goes to the local fake and links start at the app’s own address', () => {
    expect(loadConfig({ ...base, PORT: '4100' }).mail).toEqual({
      mode: 'fake',
      smtpUrl: null,
      fakePort: 0,
      from: 'Heatclock <alerts@heatclock.localhost>',
      appUrl: 'http://127.0.0.1:4100',
    });
  });

  it('when SMTP_URL is set, then mail goes there and APP_URL loses a trailing slash', () => {
    const mail = loadConfig({ ...base, SMTP_URL: 'smtps://user:pw@mail.example.org:465', APP_URL: 'https://heatclock.example.org/' }).mail;
    expect(mail).toMatchObject({ mode: 'smtp', smtpUrl: 'smtps://user:pw@mail.example.org:465', appUrl: 'https://heatclock.example.org' });
  });

  it('when the settings disagree or are malformed, then loading the configuration fails naming them', () => {
    expect(() => loadConfig({ ...base, MAIL_MODE: 'smtp' })).toThrow(/MAIL_MODE=smtp needs SMTP_URL/);
    expect(() => loadConfig({ ...base, MAIL_MODE: 'fake', SMTP_URL: 'smtp://mail.example.org' })).toThrow(/cannot be used with SMTP_URL/);
    expect(() => loadConfig({ ...base, SMTP_URL: 'https://mail.example.org' })).toThrow(/SMTP_URL: must start with smtp/);
    expect(() => loadConfig({ ...base, MAIL_MODE: 'pigeon' })).toThrow(/MAIL_MODE/);
    expect(() => loadConfig({ ...base, APP_URL: 'not a url' })).toThrow(/APP_URL/);
  });
});
