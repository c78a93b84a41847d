import { chartBars, chartData, type ChartPalette } from './allowance-chart';
import { evaluation } from './results-fixture';

const palette: ChartPalette = { allowance: 'allowance', installed: 'installed', over: 'over', text: 'text', grid: 'grid' };

describe('allowance chart data', () => {
  it('maps each space to an allowance and an installed bar, the over-allowance one in the warning colour', () => {
    const bars = chartBars(evaluation(), 'space');
    expect(bars.map((bar) => bar.label)).toEqual(['Reading room', 'Storage']);
    const data = chartData(bars, palette);
    expect(data.datasets[0]!.label).toBe('Allowance (W)');
    expect(data.datasets[0]!.data).toEqual([1000, 500]);
    expect(data.datasets[1]!.data).toEqual([800, 530]);
    expect(data.datasets[1]!.backgroundColor).toEqual(['installed', 'over']);
  });

  it('writes the status of each bar in words', () => {
    const bars = chartBars(evaluation(), 'space');
    expect(bars[0]!.words).toBe('Within allowance, 200 W (20.0 %) to spare');
    expect(bars[1]!.words).toBe('Over allowance, 30 W over');
  });

  it('groups by level when asked', () => {
    const bars = chartBars(evaluation(), 'level');
    expect(bars.map((bar) => [bar.label, bar.allowanceW, bar.installedW, bar.within])).toEqual([
      ['Level 1', 1000, 800, true],
      ['Level 2', 500, 530, false],
    ]);
  });
});
