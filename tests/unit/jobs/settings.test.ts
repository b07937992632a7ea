import { describe, expect, it } from 'vitest';
import { workerSettingsFromEnv } from '@/lib/jobs/settings';

const QUEUES = ['bath-alert-emails', 'invoice-overdue-reminders'];
const parse = (env: Record<string, string>) => workerSettingsFromEnv(env, QUEUES);

describe('worker settings from the environment', () => {
  it('leaves everything to the defaults when nothing is set, or set blank', () => {
    const none = { queues: undefined, expireInSeconds: undefined, retryDelaySeconds: undefined, superviseIntervalSeconds: undefined, pollingIntervalSeconds: undefined };
    expect(parse({})).toEqual(none);
    expect(parse({ WORKER_QUEUES: ' ', WORKER_EXPIRE_SECONDS: '' })).toEqual(none);
  });

  it('reads queues and times', () => {
    expect(
      parse({
        WORKER_QUEUES: ' invoice-overdue-reminders, bath-alert-emails,invoice-overdue-reminders',
        WORKER_EXPIRE_SECONDS: '5',
        WORKER_RETRY_DELAY_SECONDS: '0',
        WORKER_SUPERVISE_SECONDS: '1',
        WORKER_POLL_SECONDS: '0.5',
      }),
    ).toEqual({ queues: ['invoice-overdue-reminders', 'bath-alert-emails'], expireInSeconds: 5, retryDelaySeconds: 0, superviseIntervalSeconds: 1, pollingIntervalSeconds: 0.5 });
  });

  it('refuses unknown queues and times pg-boss would refuse, naming each variable', () => {
    expect(() => parse({ WORKER_QUEUES: 'bath-alert-emails,nightly-nonsense' })).toThrow(/^WORKER_QUEUES unknown queue; known: bath-alert-emails, invoice-overdue-reminders$/);
    expect(() => parse({ WORKER_QUEUES: ',,' })).toThrow(/WORKER_QUEUES name at least one queue/);
    expect(() => parse({ WORKER_EXPIRE_SECONDS: '0' })).toThrow(/WORKER_EXPIRE_SECONDS must be from 1 to 86399 seconds/);
    expect(() => parse({ WORKER_EXPIRE_SECONDS: '86400' })).toThrow(/WORKER_EXPIRE_SECONDS must be from 1/);
    expect(() => parse({ WORKER_RETRY_DELAY_SECONDS: '1.5' })).toThrow(/WORKER_RETRY_DELAY_SECONDS must be a whole number/);
    expect(() => parse({ WORKER_SUPERVISE_SECONDS: 'soon' })).toThrow(/WORKER_SUPERVISE_SECONDS must be a number of seconds/);
    expect(() => parse({ WORKER_POLL_SECONDS: '0.1', WORKER_EXPIRE_SECONDS: '-3' })).toThrow(/WORKER_EXPIRE_SECONDS .*; WORKER_POLL_SECONDS must be from 0.5 to 3600 seconds/);
  });
});
