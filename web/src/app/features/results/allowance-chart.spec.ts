import { formatPercent, formatWatts } from '../../shared/format';
import { libraryAnnex, readingRoom, storageRoom } from '../../../testing/demo-building';
import { evaluated, spaceOf } from '../../../testing/evaluate';
import { chartBars, chartData, type ChartPalette } from './allowance-chart';

const palette: ChartPalette = { allowance: 'allowance', installed: 'installed', over: 'over', text: 'text', grid: 'grid' };

// The invented library annex (testing/demo-building.ts): the reading room on Level 1 is within its allowance
// (960 W allowed, 800 W installed), the storage room on Level 2 over its own (190 W allowed, 240 W installed).
const result = evaluated(libraryAnnex());
const reading = spaceOf(result, readingRoom.id);
const storage = spaceOf(result, storageRoom.id);
const levels = result.interior.levels ?? [];

describe('allowance chart data', () => {
  it('maps each space to an allowance and an installed bar, the over-allowance one in the warning colour', () => {
    expect([reading.withinAllowance, storage.withinAllowance]).toEqual([true, false]);
    const bars = chartBars(result, 'space');
    expect(bars.map((bar) => bar.label)).toEqual([reading.name, storage.name]);
    const data = chartData(bars, palette);
    expect(data.datasets[0]!.label).toBe('Allowance (W)');
    expect(data.datasets[0]!.data).toEqual([Number(reading.allowanceW), Number(storage.allowanceW)]);
    expect(data.datasets[1]!.label).toBe('Installed (W)');
    expect(data.datasets[1]!.data).toEqual([Number(reading.installedW), Number(storage.installedW)]);
    expect(data.datasets[1]!.backgroundColor).toEqual(['installed', 'over']);
  });

  it('writes the status of each bar in words', () => {
    const bars = chartBars(result, 'space');
    expect(bars[0]!.words).toBe(`Within allowance, ${formatWatts(reading.marginW)} (${formatPercent(reading.marginPct)}) to spare`);
    expect(bars[1]!.words).toBe(`Over allowance, ${formatWatts(String(-Number(storage.marginW)))} over`);
  });

  it('groups by level when asked', () => {
    expect(levels.map((level) => level.level)).toEqual(['Level 1', 'Level 2']);
    const bars = chartBars(result, 'level');
    expect(bars.map((bar) => [bar.label, bar.allowanceW, bar.installedW, bar.within])).toEqual([
      ['Level 1', Number(levels[0]!.allowanceW), Number(levels[0]!.installedW), true],
      ['Level 2', Number(levels[1]!.allowanceW), Number(levels[1]!.installedW), false],
    ]);
  });
});
