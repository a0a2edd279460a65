// Benchmark of @stringfield/pv (issue 3): `npm run bench -w packages/pv`.
// Uses an invented 72-cell module (no brand). Timings are wall-clock medians on this machine.
import { bishopDiodeVoltage } from '../src/bishop-diode-voltage.ts';
import { diagnoseStringCheck } from '../src/diagnose-string-check.ts';
import { SIMULATION_DEFAULTS } from '../src/simulation-defaults.ts';
import { simulateString } from '../src/simulate-string.ts';
import { singleDiodeParamsAt } from '../src/single-diode-params-at.ts';
import type { ModuleSpec } from '../src/types.ts';

const module: ModuleSpec = {
  pmaxW: 320,
  vocV: 46.2,
  iscA: 9.1,
  vmpV: 37.4,
  impA: 8.56,
  alphaIscPctPerC: 0.05,
  betaVocPctPerC: -0.3,
  gammaPmaxPctPerC: -0.39,
  cellsInSeries: 72,
  bypassDiodes: 3,
};
const modulesInSeries = 30;
const shading = [0, 10, 20].map((m) => ({ module: m, cell: 5, fraction: 0.7 }));
const conditions = { irradianceWm2: 1000, moduleTempC: 45 };

const medianOf = (xs: number[]): number => {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.floor(s.length / 2)] ?? NaN;
};
const time = (runs: number, f: () => void): number[] => {
  const out: number[] = [];
  for (let r = 0; r < runs; r += 1) {
    const t0 = performance.now();
    f();
    out.push(performance.now() - t0);
  }
  return out;
};

// 1. simulateString, 30 × 72 cells, 3 shaded cells, 400 points.
let result = simulateString({ module, modulesInSeries, ...conditions, shading, points: 400 });
time(20, () => (result = simulateString({ module, modulesInSeries, ...conditions, shading, points: 400 }))); // warm-up
const simTimes = time(
  100,
  () => (result = simulateString({ module, modulesInSeries, ...conditions, shading, points: 400 })),
);
const simMedian = medianOf(simTimes);

// 2. 1,000 diagnoseStringCheck calls on varied readings.
const readings = Array.from({ length: 1000 }, (_, k) => ({
  vocV: 1290 - (k % 7) * 15.4 + (k % 13) * 0.8,
  iscA: 8.5 + (k % 11) * 0.08,
  irradianceWm2: 600 + (k % 40) * 10,
  moduleTempC: 20 + (k % 30),
}));
const diagnoseAll = (): void => {
  for (const measured of readings)
    diagnoseStringCheck({
      module,
      modulesInSeries,
      measured,
      peers: [
        { vocV: 1290, iscA: 8.9 },
        { vocV: 1288, iscA: 8.95 },
      ],
    });
};
time(3, diagnoseAll); // warm-up
const diagTimes = time(15, diagnoseAll);
const diagMedian = medianOf(diagTimes);

// 3. Grouping: the string voltage at 400 currents, grouped (one curve per distinct cell) vs naive (every one of 2,160 cells solved).
const p = singleDiodeParamsAt(module, {
  irradianceWm2: conditions.irradianceWm2,
  cellTempC: conditions.moduleTempC,
});
const ns = module.cellsInSeries;
const base = {
  ...p,
  seriesOhm: p.seriesOhm / ns,
  shuntOhm: p.shuntOhm / ns,
  modifiedIdealityV: p.modifiedIdealityV / ns,
};
const reverse = SIMULATION_DEFAULTS.reverse;
const dropV = SIMULATION_DEFAULTS.bypassDiodeDropV;
const cellsPerSub = ns / module.bypassDiodes;
const photo = (m: number, c: number): number => {
  const s = shading.find((x) => x.module === m && x.cell === c);
  return base.photoCurrentA * (1 - (s?.fraction ?? 0));
};
const currents = Array.from({ length: 400 }, (_, k) => (9.0 * k) / 399);
const naive = (): number => {
  let check = 0;
  for (const i of currents) {
    let v = 0;
    for (let m = 0; m < modulesInSeries; m += 1) {
      for (let s = 0; s < module.bypassDiodes; s += 1) {
        let sub = 0;
        for (let c = s * cellsPerSub; c < (s + 1) * cellsPerSub; c += 1) {
          const cell = { ...base, photoCurrentA: photo(m, c) };
          sub += bishopDiodeVoltage(cell, reverse, i) - i * base.seriesOhm;
        }
        v += Math.max(sub, -dropV);
      }
    }
    check += v;
  }
  return check;
};
const grouped = (): number => {
  const shaded = { ...base, photoCurrentA: base.photoCurrentA * 0.3 };
  let check = 0;
  for (const i of currents) {
    const vHealthy = bishopDiodeVoltage(base, reverse, i) - i * base.seriesOhm;
    const vShaded = bishopDiodeVoltage(shaded, reverse, i) - i * base.seriesOhm;
    const healthySub = cellsPerSub * vHealthy;
    const shadedSub = (cellsPerSub - 1) * vHealthy + vShaded;
    check +=
      (modulesInSeries * module.bypassDiodes - 3) * Math.max(healthySub, -dropV) +
      3 * Math.max(shadedSub, -dropV);
  }
  return check;
};
let sink = 0;
time(3, () => (sink += naive() + grouped()));
const naiveMedian = medianOf(time(5, () => (sink += naive())));
const groupedMedian = medianOf(time(50, () => (sink += grouped())));
const agree = Math.abs(naive() - grouped()) <= 1e-6 * Math.abs(grouped());

const ms = (x: number): string => `${x.toFixed(2)} ms`;
console.log(
  '@stringfield/pv benchmark (invented 72-cell module, 30 in series, 3 cells shaded 70 %, 1000 W/m², 45 °C)',
);
console.log(
  `  simulateString, 400 points       median ${ms(simMedian)}  (min ${ms(Math.min(...simTimes))}, max ${ms(Math.max(...simTimes))}; target < 5 ms) ${simMedian < 5 ? 'OK' : 'OVER TARGET'}`,
);
console.log(
  `    Pmp ${result.pmpW.toFixed(1)} W at ${result.vmpV.toFixed(1)} V, ${result.impA.toFixed(2)} A; ${result.bypassedSubstringsAtMpp} substrings bypassed at MPP; ${result.distinctCells} distinct cell curves, ${result.distinctSubstrings} distinct substrings`,
);
console.log(
  `  1,000 diagnoseStringCheck calls  median ${ms(diagMedian)}  (target < 50 ms) ${diagMedian < 50 ? 'OK' : 'OVER TARGET'}`,
);
console.log(
  `  string V at 400 currents: naive per-cell (2,160 cells) ${ms(naiveMedian)}, grouped (2 distinct cells) ${ms(groupedMedian)}`,
);
console.log(
  `    ratio naive / grouped ${(naiveMedian / groupedMedian).toFixed(0)}×; results agree: ${agree ? 'yes' : 'NO'}${sink === 0 ? '' : ''}`,
);
