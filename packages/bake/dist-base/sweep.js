/**
 * The sample-budget sweep: for each method and budget, bake the specular chain (levels >= 1) of one probe,
 * time it (median of repeats) and measure each level against the brute-force reference convolution:
 * relative RMSE of BT.709 luminance, and the 99.9th-percentile texel error (|Y - Y_ref| over the level's
 * mean reference luminance), where fireflies show. Writes nothing itself; see sweepReport() for files.
 */
import { readFileSync } from 'node:fs';
import { luminance } from '@lightkiln/math';
import { WorkerPool, getSharedPool } from '@lightkiln/pool';
import { aborted, invalidOption, LightkilnError, toLightkilnError } from './errors.js';
import { levelDescriptors, resolveRecipe, SAMPLE_PRESETS } from './recipe.js';
import { buildPyramid } from './stages/pyramid.js';
import { decodeSource } from './stages/source.js';
import { prefilterLevels } from './stages/specular.js';
export const SWEEP_METHODS = ['plain', 'filtered', 'filtered-rotated', 'quadrature'];
function levelErrors(test, ref) {
    const n = ref.length / 3;
    const errs = new Float64Array(n);
    let se = 0;
    let sumY = 0;
    for (let t = 0; t < n; t++) {
        const yr = luminance(ref[t * 3], ref[t * 3 + 1], ref[t * 3 + 2]);
        const yt = luminance(test[t * 3], test[t * 3 + 1], test[t * 3 + 2]);
        se += (yt - yr) ** 2;
        sumY += yr;
        errs[t] = Math.abs(yt - yr);
    }
    const mean = sumY / n;
    errs.sort();
    const idx = Math.min(n - 1, Math.ceil(0.999 * n) - 1);
    return { rmse: Math.sqrt(se / n) / mean, p999: errs[idx] / mean };
}
function median(values) {
    const s = [...values].sort((a, b) => a - b);
    return s.length % 2 === 1 ? s[s.length >> 1] : (s[s.length / 2 - 1] + s[s.length / 2]) / 2;
}
/** log-log interpolation of y at x along points sorted by x (clamped to the ends). */
function interpolateLogLog(points, x) {
    const p = [...points].sort((a, b) => a.x - b.x);
    if (x <= p[0].x)
        return p[0].y;
    if (x >= p[p.length - 1].x)
        return p[p.length - 1].y;
    for (let i = 1; i < p.length; i++) {
        if (x <= p[i].x) {
            const a = p[i - 1];
            const b = p[i];
            const t = (Math.log(x) - Math.log(a.x)) / (Math.log(b.x) - Math.log(a.x));
            return Math.exp(Math.log(Math.max(a.y, 1e-12)) * (1 - t) + Math.log(Math.max(b.y, 1e-12)) * t);
        }
    }
    return p[p.length - 1].y;
}
export async function sweepBudgets(options) {
    try {
        const recipe = resolveRecipe(options.recipe);
        const budgets = options.budgets ?? [16, 32, 64, 128, 256, 512, 1024, 2048, 'default'];
        const methods = options.methods ?? SWEEP_METHODS;
        const repeats = options.repeats ?? 3;
        if (!Number.isInteger(repeats) || repeats < 1 || repeats > 50)
            throw invalidOption('repeats', 'must be an integer in 1..50', repeats);
        for (const b of budgets)
            if (b !== 'default' && (!Number.isInteger(b) || b < 1 || b > recipe.limits.maxSamples))
                throw invalidOption('budgets', `entries must be integers in 1..${recipe.limits.maxSamples} or "default"`, b);
        for (const m of methods)
            if (!SWEEP_METHODS.includes(m))
                throw invalidOption('methods', `entries must be one of ${SWEEP_METHODS.join(', ')}`, m);
        const ownPool = options.threads === 0 ? new WorkerPool({ threads: 0 }) : null;
        const pool = ownPool ?? getSharedPool(options.threads === undefined ? {} : { threads: options.threads });
        const ctx = { pool, signal: options.signal, onProgress: options.onProgress, targetTileCost: undefined };
        try {
            const raw = options.recipe.input;
            const bytes = raw.bytes ?? (raw.path !== undefined ? readFileSync(raw.path) : null);
            if (bytes === null)
                throw new LightkilnError('INVALID_RECIPE', 'invalid recipe: the sweep takes input.path or input.bytes');
            const source = decodeSource(recipe, [{ name: recipe.input.name, bytes: new Uint8Array(bytes.buffer, bytes.byteOffset, bytes.byteLength) }]);
            const pyramid = await buildPyramid(source, recipe.size, recipe.rotationDeg, ctx);
            const levelRequests = (samples) => levelDescriptors(recipe, samples).slice(1);
            const t0 = performance.now();
            const reference = await prefilterLevels(pyramid, levelRequests(recipe.samples), { ...recipe, quality: 'reference' }, ctx);
            const referenceMs = performance.now() - t0;
            const [lo, hi] = SAMPLE_PRESETS.default;
            const presetSamples = recipe.roughness.map((r) => Math.max(8, Math.round((lo + (hi - lo) * r) / 8) * 8));
            // One untimed run first, so the JIT has compiled the kernel before the first timed point.
            await prefilterLevels(pyramid, levelRequests(recipe.roughness.map(() => 16)), { ...recipe, quality: 'sampled' }, ctx);
            const points = [];
            for (const method of methods) {
                for (const budget of method === 'quadrature' ? ['default'] : budgets) {
                    if (options.signal?.aborted)
                        throw aborted(options.signal.reason);
                    const samples = budget === 'default' ? presetSamples : recipe.roughness.map(() => budget);
                    const spec = method === 'quadrature'
                        ? { ...recipe, quality: 'quadrature' }
                        : { ...recipe, quality: 'sampled', filtered: method !== 'plain', rotateSequence: method === 'filtered-rotated' };
                    const times = [];
                    let levels = [];
                    for (let r = 0; r < repeats; r++) {
                        const started = performance.now();
                        levels = await prefilterLevels(pyramid, levelRequests(samples), spec, ctx);
                        times.push(performance.now() - started);
                    }
                    const errors = levels.map((level, i) => levelErrors(level.data, reference[i].data));
                    points.push({ method, budget, medianMs: median(times), repeats, relativeRmse: [0, ...errors.map((e) => e.rmse)], p999: [0, ...errors.map((e) => e.p999)] });
                }
            }
            return { probe: recipe.name, size: recipe.size, roughness: recipe.roughness, referenceMs, points, summary: summarise(points) };
        }
        finally {
            if (ownPool !== null)
                await ownPool.close();
        }
    }
    catch (error) {
        throw toLightkilnError(error);
    }
}
function summarise(points) {
    const worst = (v) => Math.max(...v);
    const filtered = points.filter((p) => p.method === 'filtered');
    const under = filtered.filter((p) => p.budget !== 'default' && worst(p.relativeRmse) < 0.01).sort((a, b) => a.medianMs - b.medianMs);
    const cheapest = under[0] ?? null;
    const def = filtered.find((p) => p.budget === 'default') ?? null;
    const plain = points.filter((p) => p.method === 'plain' && p.budget !== 'default');
    const plainDefault = points.find((p) => p.method === 'plain' && p.budget === 'default') ?? null;
    let ratio = null;
    const filteredCurve = filtered.filter((p) => p.budget !== 'default');
    if (plainDefault !== null && plain.length > 1 && filteredCurve.length > 1) {
        const t = plainDefault.medianMs;
        const plainAtT = interpolateLogLog(plain.map((p) => ({ x: p.medianMs, y: worst(p.p999) })), t);
        const filteredAtT = interpolateLogLog(filteredCurve.map((p) => ({ x: p.medianMs, y: worst(p.p999) })), t);
        ratio = filteredAtT / plainAtT;
    }
    return {
        cheapestUnderOnePercent: cheapest === null ? null : { budget: cheapest.budget, medianMs: cheapest.medianMs },
        defaultMs: def?.medianMs ?? null,
        defaultOverCheapest: def !== null && cheapest !== null ? def.medianMs / cheapest.medianMs : null,
        filteredOverPlainP999AtDefaultTime: ratio,
    };
}
/** CSV, Markdown and SVG (error vs time, log-log, one line per method) of a sweep. */
export function sweepReport(result) {
    const levels = result.roughness.length;
    const head = ['method', 'budget', 'median_ms', 'repeats', ...Array.from({ length: levels - 1 }, (_, i) => `rmse_l${i + 1}`), ...Array.from({ length: levels - 1 }, (_, i) => `p999_l${i + 1}`)];
    const csv = [head.join(','), ...result.points.map((p) => [p.method, p.budget, p.medianMs.toFixed(2), p.repeats, ...p.relativeRmse.slice(1).map((v) => v.toExponential(4)), ...p.p999.slice(1).map((v) => v.toExponential(4))].join(','))].join('\n') + '\n';
    const pct = (v) => `${(v * 100).toFixed(2)}`;
    const s = result.summary;
    const md = [
        `# Sample-budget sweep: ${result.probe} (${result.size}^2 faces, ${levels} levels)`,
        '',
        `Timings are medians of ${result.points[0]?.repeats ?? 0} runs of the specular chain (levels 1..${levels - 1}); errors are against the brute-force reference (${result.referenceMs.toFixed(0)} ms), in % of each level's mean luminance.`,
        '',
        `| method | budget | ms | worst-level RMSE % | worst-level p99.9 % | ${result.roughness.slice(1).map((r) => `RMSE % r=${r.toFixed(2)}`).join(' | ')} |`,
        `| --- | --- | --- | --- | --- | ${result.roughness.slice(1).map(() => '---').join(' | ')} |`,
        ...result.points.map((p) => `| ${p.method} | ${p.budget} | ${p.medianMs.toFixed(1)} | ${pct(Math.max(...p.relativeRmse))} | ${pct(Math.max(...p.p999))} | ${p.relativeRmse.slice(1).map(pct).join(' | ')} |`),
        '',
        `- cheapest filtered budget under 1% RMSE on every level: ${s.cheapestUnderOnePercent === null ? 'none in this sweep' : `${s.cheapestUnderOnePercent.budget} (${s.cheapestUnderOnePercent.medianMs.toFixed(1)} ms)`}`,
        `- default preset (filtered): ${s.defaultMs === null ? 'not swept' : `${s.defaultMs.toFixed(1)} ms`}${s.defaultOverCheapest === null ? '' : `, ${s.defaultOverCheapest.toFixed(2)}x the cheapest`}`,
        `- filtered / plain worst-level p99.9 error at the plain default-preset time: ${s.filteredOverPlainP999AtDefaultTime === null ? 'n/a' : s.filteredOverPlainP999AtDefaultTime.toFixed(3)}`,
        '',
    ].join('\n');
    return { csv, markdown: md, svg: sweepSvg(result) };
}
function sweepSvg(result) {
    const W = 900;
    const H = 380;
    const panels = [
        { title: 'worst-level relative RMSE', value: (p) => Math.max(...p.relativeRmse) },
        { title: 'worst-level 99.9th-percentile error', value: (p) => Math.max(...p.p999) },
    ];
    const colours = { plain: '#c0392b', filtered: '#2471a3', 'filtered-rotated': '#229954', quadrature: '#7d3c98' };
    const pts = result.points.filter((p) => p.budget !== 'default' || p.method === 'quadrature');
    const xs = pts.map((p) => Math.log10(Math.max(p.medianMs, 1e-3)));
    const x0 = Math.floor(Math.min(...xs));
    const x1 = Math.ceil(Math.max(...xs));
    const parts = [`<svg xmlns="http://www.w3.org/2000/svg" width="${W}" height="${H}" viewBox="0 0 ${W} ${H}" font-family="sans-serif" font-size="12">`, `<rect width="${W}" height="${H}" fill="#ffffff"/>`];
    panels.forEach((panel, k) => {
        const left = 60 + k * (W / 2);
        const top = 30;
        const pw = W / 2 - 90;
        const ph = H - 80;
        const ys = pts.map((p) => Math.log10(Math.max(panel.value(p), 1e-6)));
        const y0 = Math.floor(Math.min(...ys));
        const y1 = Math.ceil(Math.max(...ys));
        const X = (v) => left + ((v - x0) / Math.max(1e-9, x1 - x0)) * pw;
        const Y = (v) => top + ph - ((v - y0) / Math.max(1e-9, y1 - y0)) * ph;
        parts.push(`<text x="${left}" y="18" font-weight="bold">${panel.title} vs time (log-log)</text>`);
        parts.push(`<rect x="${left}" y="${top}" width="${pw}" height="${ph}" fill="none" stroke="#888"/>`);
        for (let d = x0; d <= x1; d++)
            parts.push(`<line x1="${X(d)}" y1="${top + ph}" x2="${X(d)}" y2="${top + ph + 4}" stroke="#888"/><text x="${X(d)}" y="${top + ph + 16}" text-anchor="middle">${10 ** d} ms</text>`);
        for (let d = y0; d <= y1; d++)
            parts.push(`<line x1="${left - 4}" y1="${Y(d)}" x2="${left}" y2="${Y(d)}" stroke="#888"/><text x="${left - 6}" y="${Y(d) + 4}" text-anchor="end">${+(100 * 10 ** d).toPrecision(3)}%</text>`);
        const methods = [...new Set(pts.map((p) => p.method))];
        methods.forEach((m, i) => {
            const line = pts.filter((p) => p.method === m).sort((a, b) => a.medianMs - b.medianMs);
            const d = line.map((p, j) => `${j === 0 ? 'M' : 'L'}${X(Math.log10(Math.max(p.medianMs, 1e-3))).toFixed(1)},${Y(Math.log10(Math.max(panel.value(p), 1e-6))).toFixed(1)}`).join(' ');
            parts.push(`<path d="${d}" fill="none" stroke="${colours[m]}" stroke-width="2"/>`);
            for (const p of line)
                parts.push(`<circle cx="${X(Math.log10(Math.max(p.medianMs, 1e-3))).toFixed(1)}" cy="${Y(Math.log10(Math.max(panel.value(p), 1e-6))).toFixed(1)}" r="3" fill="${colours[m]}"><title>${m} ${p.budget}: ${p.medianMs.toFixed(1)} ms</title></circle>`);
            parts.push(`<text x="${left + 8}" y="${top + 16 + i * 15}" fill="${colours[m]}">${m}</text>`);
        });
        for (const p of result.points.filter((q) => q.budget === 'default')) {
            parts.push(`<rect x="${X(Math.log10(p.medianMs)) - 4}" y="${Y(Math.log10(Math.max(panel.value(p), 1e-6))) - 4}" width="8" height="8" fill="none" stroke="${colours[p.method]}" stroke-width="2"><title>${p.method} default preset</title></rect>`);
        }
    });
    parts.push(`<text x="60" y="${H - 8}" fill="#555">squares: the default preset; ${result.probe}, ${result.size}^2 faces</text>`, '</svg>');
    return `${parts.join('\n')}\n`;
}
//# sourceMappingURL=sweep.js.map