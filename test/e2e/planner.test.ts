/**
 * The resilience planner in a real browser at phone and wide size: the
 * resilience screen shows avoidable weak points apart from the ones no feed
 * can fix, a proposal, the critical pairs once computed, and "Try it" shows
 * the sandbox banner (nothing is stored; the test does not create for real).
 */
import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { DiversityAnswer, ProposalsAnswer } from '@/shared/schemas/analysis';
import { apiGet, baseUrl, launch, openPage, shot, signIn, SIZES } from './browser';
import { seriousViolations } from './axe';

let browser: Browser;
beforeAll(async () => {
  browser = await launch();
});
afterAll(async () => browser?.close());

describe.each(Object.entries(SIZES))('resilience planner at %s size', (sizeName, size) => {
  it('shows avoidable weak points, a proposal, the pairs, and the sandbox banner after "Try it"', async () => {
    const diversity = await apiGet<DiversityAnswer>('/api/analysis/diversity');
    // the ranking over the network runs in the background: 202 with progress until it is done
    let proposals = await apiGet<ProposalsAnswer & { state: 'running' | 'done' }>('/api/analysis/proposals?limit=20');
    for (let i = 0; i < 600 && proposals.state === 'running'; i++) {
      await new Promise((resolve) => setTimeout(resolve, 100));
      proposals = await apiGet('/api/analysis/proposals?limit=20');
    }
    expect(proposals.state).toBe('done');
    expect(diversity.carriages.length).toBeGreaterThan(0);
    expect(proposals.proposals.length).toBeGreaterThan(0);
    const { page, errors } = await openPage(browser, size);
    await signIn(page, 'engineer');
    await page.goto(`${baseUrl()}/resilience`);
    const gaps = page.getByTestId('resilience-diversity');
    await gaps.getByText('Another feed could avoid', { exact: false }).first().waitFor({ timeout: 30_000 });
    const first = proposals.proposals[0];
    const proposalSection = page.getByTestId('resilience-proposals');
    await proposalSection.getByText(`${first.carriage}: new`, { exact: false }).first().waitFor({ timeout: 30_000 });
    expect(await proposalSection.innerText()).toContain('Rule of thumb');
    await page.getByTestId('resilience-pairs').getByText('together take', { exact: false }).first().waitFor({ timeout: 60_000 });

    await page.getByTestId('plan-try').click();
    const banner = page.getByTestId('sandbox-banner');
    await banner.waitFor({ timeout: 60_000 });
    const text = await banner.innerText();
    expect(text).toContain('Sandbox: nothing here is stored');
    expect(text).toContain('With the plan');
    await page.getByTestId('plan-create').waitFor();
    await shot(page, `planner-sandbox-${sizeName}`);
    const v = await seriousViolations(page);
    expect(v, JSON.stringify(v)).toEqual([]);
    await page.getByTestId('plan-leave').click();
    await banner.waitFor({ state: 'detached' });
    expect(errors).toEqual([]);
    await page.context().close();
  });
});
