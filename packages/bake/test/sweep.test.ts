import { afterAll, describe, expect, it } from 'vitest';
import { closeSharedPools, sweepBudgets, sweepReport } from '@lightkiln/bake';
import { equirectOf } from './helpers.js';

afterAll(async () => {
  await closeSharedPools();
});

// A sky of our own with a small, very bright spot, where plain importance sampling is noisy.
const bytes = equirectOf((x, y, z) => {
  const s = Math.exp((0.5 * x + 0.6 * y - 0.62 * z - 1) * 400) * 3000;
  return [0.5 + 0.3 * y + s, 0.6 + s, 0.9 - 0.2 * y + s];
}, 128, 64);

describe('sample-budget sweep', () => {
  it('measures error against the reference for every method and budget, and falls with the budget', async () => {
    const result = await sweepBudgets({ recipe: { input: { bytes, name: 'spot.pfm' }, size: 16, levels: 5 }, budgets: [16, 1024, 'default'], methods: ['plain', 'filtered'], repeats: 1, threads: 2 });
    expect(result.points).toHaveLength(6);
    for (const p of result.points) {
      expect(p.relativeRmse).toHaveLength(5);
      expect(p.relativeRmse[0]).toBe(0);
      expect(p.medianMs).toBeGreaterThan(0);
      for (let m = 1; m < 5; m++) expect(p.p999[m]).toBeGreaterThanOrEqual(0);
    }
    const worst = (method: string, budget: number | 'default'): number => Math.max(...result.points.find((p) => p.method === method && p.budget === budget)!.relativeRmse);
    expect(worst('filtered', 1024)).toBeLessThan(worst('filtered', 16));
    expect(worst('plain', 1024)).toBeLessThan(worst('plain', 16));
    expect(result.summary.defaultMs).toBeGreaterThan(0);
    const report = sweepReport(result);
    expect(report.csv.split('\n')[0]).toBe('method,budget,median_ms,repeats,rmse_l1,rmse_l2,rmse_l3,rmse_l4,p999_l1,p999_l2,p999_l3,p999_l4');
    expect(report.csv.trim().split('\n')).toHaveLength(7);
    expect(report.markdown).toContain('| filtered | default |');
    expect(report.svg.startsWith('<svg xmlns="http://www.w3.org/2000/svg"')).toBe(true);
    expect(report.svg.match(/<path /g)).toHaveLength(4); // two methods x two panels
  });

  it('refuses bad budgets and methods by name', async () => {
    await expect(sweepBudgets({ recipe: { input: { bytes, name: 'spot.pfm' }, size: 8 }, budgets: [0] })).rejects.toThrow(/option "budgets"/);
    await expect(sweepBudgets({ recipe: { input: { bytes, name: 'spot.pfm' }, size: 8 }, methods: ['magic' as never] })).rejects.toThrow(/option "methods"/);
    await expect(sweepBudgets({ recipe: { input: { bytes, name: 'spot.pfm' }, size: 8 }, repeats: 0 })).rejects.toThrow(/option "repeats"/);
  });
});
