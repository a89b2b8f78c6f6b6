import { carry } from '../../src/lib/pattern/panels/carry';
import { benchPanels } from '../../src/lib/pattern/panels/fixtures/bench-pieces';
import { lineSegment } from '../../src/lib/pattern/kernel';
const n = Number(process.argv[2] ?? 2000);
const { panels, seams } = benchPanels(n);
const styleLine = { segments: [lineSegment({ x: -10, y: 200 }, { x: 220, y: 200 })] };
const times: number[] = [];
for (let i = 0; i < 1500; i++) {
  const t = performance.now();
  const r = carry(panels.map((p) => ({ ...p })), seams, { styleLine, fuse: 'below' });
  times.push(performance.now() - t);
  if (!r.ok) throw new Error('fail');
}
times.sort((a, b) => a - b);
console.log('median', times[times.length >> 1].toFixed(2), 'p10', times[150].toFixed(2));
