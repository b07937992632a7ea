// The README's API example, sent as it is printed: the answer must say what the README says it
// says. A change to the engine or the route that moves the figure fails here until the README is
// brought along.
import { readFileSync } from 'node:fs';
import { afterAll, describe, expect, it, vi } from 'vitest';
import { db } from '@/db';
import { postEstimate, signInAs, signOutAll } from './estimating/route-session';

vi.mock('next/headers', async () => (await import('./estimating/cookie-jar')).nextHeadersStandIn());

afterAll(async () => {
  await signOutAll();
  await db.destroy();
});

const README = readFileSync(new URL('../../README.md', import.meta.url), 'utf8');
const api = README.slice(README.indexOf('\n## API'));

describe('README, "API"', () => {
  it('prints a request the estimate route accepts, and the amp-hours it answers', async () => {
    const block = /```json\n([\s\S]*?)```/.exec(api);
    expect(block, 'the API section has a JSON request').not.toBeNull();
    const body: unknown = JSON.parse(block![1]!);
    const said = /"ampHoursLot": \{ "value": ([\d.]+), "unit": "A·h" \}/.exec(api);
    expect(said, 'the API section quotes ampHoursLot').not.toBeNull();

    await signInAs('estimator@kestrel-plating.test');
    const r = await postEstimate(body);
    expect(r.status, r.text).toBe(200);
    const answer = r.json.results.ampHoursLot;
    expect(answer.unit).toBe('A·h');
    // The README rounds as it prints: compare at its own number of decimals.
    const decimals = said![1]!.split('.')[1]?.length ?? 0;
    expect(answer.value.toFixed(decimals)).toBe(said![1]);
  });
});
