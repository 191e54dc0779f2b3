import { createWelchAccumulator } from '../shared/dsp/welch';
const n = 1920000; const i = new Float32Array(n), q = new Float32Array(n);
for (let k = 0; k < n; k++) { i[k] = Math.random(); q[k] = Math.random(); }
(globalThis as any).T = {};
for (let r = 0; r < 8; r++) { const T = (globalThis as any).T; T.win=0; T.fft=0; T.acc=0; T.fill=0;
  const t0 = performance.now();
  const acc = createWelchAccumulator({ sampleRateHz: 192000, segmentLength: 16384 });
  for (let p = 0; p < n; p += 65536) acc.push(i.subarray(p, p + 65536), q.subarray(p, p + 65536));
  console.log((performance.now() - t0).toFixed(1), JSON.stringify(T, (k,v)=> typeof v==="number"? +v.toFixed(1):v));
}
