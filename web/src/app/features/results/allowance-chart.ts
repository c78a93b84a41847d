import { afterNextRender, ChangeDetectionStrategy, Component, computed, input, signal } from '@angular/core';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import type { ChartConfiguration, ChartData } from 'chart.js';
import { BaseChartDirective, provideCharts, withDefaultRegisterables } from 'ng2-charts';
import type { EvaluationResult } from '../../core/api/api-types';
import { allowanceStatus, spaceAllowanceStatus } from '../../shared/allowance-status';
import { phoneScreen, screenMatches } from '../../shared/media-queries';

export type ChartGrouping = 'space' | 'level';

export interface ChartPalette {
  allowance: string;
  installed: string;
  over: string;
  text: string;
  grid: string;
}

export interface ChartBar {
  label: string;
  allowanceW: number;
  installedW: number;
  within: boolean;
  /** The status in words, for the tooltip and the text summary beside the chart. */
  words: string;
}

/** One bar pair per space (in the result's order) or per level; watts as numbers only for drawing. */
export function chartBars(result: EvaluationResult, by: ChartGrouping): ChartBar[] {
  if (by === 'space') {
    return result.interior.spaces.map((space) => {
      // A space without luminaires has no margin to speak of: its words say what it waits for.
      const status = spaceAllowanceStatus(space);
      return {
        label: space.name,
        allowanceW: Number(space.allowanceW),
        installedW: Number(space.installedW),
        within: !status.over,
        words: `${status.label}, ${status.words}`,
      };
    });
  }
  return (result.interior.levels ?? []).map((level) => {
    const status = allowanceStatus(Number(level.marginW) >= 0, level.marginW);
    return {
      label: level.level,
      allowanceW: Number(level.allowanceW),
      installedW: Number(level.installedW),
      within: status.within,
      words: `${status.label}, ${status.words}`,
    };
  });
}

/** Allowance and installed datasets; an installed bar over its allowance takes the error colour (and says so in words). */
export function chartData(bars: readonly ChartBar[], palette: ChartPalette): ChartData<'bar', number[], string> {
  return {
    labels: bars.map((bar) => bar.label),
    datasets: [
      { label: 'Allowance (W)', data: bars.map((bar) => Math.round(bar.allowanceW)), backgroundColor: palette.allowance, borderRadius: 3 },
      {
        label: 'Installed (W)',
        data: bars.map((bar) => Math.round(bar.installedW)),
        backgroundColor: bars.map((bar) => (bar.within ? palette.installed : palette.over)),
        borderRadius: 3,
      },
    ],
  };
}

const fallbackPalette: ChartPalette = { allowance: '#8fcdd0', installed: '#00696d', over: '#ba1a1a', text: '#3f4948', grid: '#dae5e4' };

/** Resolves theme colours (which may be light-dark() pairs) through a probe element the browser computes. */
function themePalette(host: HTMLElement): ChartPalette {
  const probe = document.createElement('span');
  host.appendChild(probe);
  const read = (token: string, fallback: string) => {
    probe.style.color = `var(${token})`;
    const colour = getComputedStyle(probe).color;
    return colour && colour !== '' ? colour : fallback;
  };
  const palette: ChartPalette = {
    allowance: read('--mat-sys-secondary-container', fallbackPalette.allowance),
    installed: read('--mat-sys-primary', fallbackPalette.installed),
    over: read('--mat-sys-error', fallbackPalette.over),
    text: read('--mat-sys-on-surface-variant', fallbackPalette.text),
    grid: read('--mat-sys-outline-variant', fallbackPalette.grid),
  };
  probe.remove();
  return palette;
}

/** Allowance against installed power by space or by level, with the same verdicts written out below it. */
@Component({
  selector: 'al-allowance-chart',
  imports: [BaseChartDirective, MatButtonToggleModule],
  providers: [provideCharts(withDefaultRegisterables())],
  templateUrl: './allowance-chart.html',
  styleUrl: './allowance-chart.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AllowanceChart {
  readonly result = input.required<EvaluationResult>();
  readonly updating = input(false);

  protected readonly by = signal<ChartGrouping>('space');
  private readonly palette = signal<ChartPalette>(fallbackPalette);
  protected readonly hasLevels = computed(() => (this.result().interior.levels ?? []).length > 0);
  protected readonly bars = computed(() => chartBars(this.result(), this.hasLevels() ? this.by() : 'space'));
  protected readonly data = computed(() => chartData(this.bars(), this.palette()));
  protected readonly overBars = computed(() => this.bars().filter((bar) => !bar.within));
  protected readonly height = computed(() => Math.max(160, this.bars().length * 26 + 60));
  protected readonly summary = computed(() => {
    const over = this.overBars();
    const what = this.by() === 'level' && this.hasLevels() ? 'level' : 'space';
    return over.length === 0
      ? `Every ${what} is within its allowance.`
      : `${over.length} ${what}${over.length === 1 ? ' is' : 's are'} over allowance: ${over.map((bar) => `${bar.label} (${bar.words})`).join('; ')}.`;
  });
  /** On a phone the chart is too narrow for long space names beside the bars, or for every tick of the watts. */
  private readonly phone = screenMatches(phoneScreen);
  protected readonly options = computed<ChartConfiguration<'bar', number[], string>['options']>(() => {
    const palette = this.palette();
    const bars = this.bars();
    const phone = this.phone();
    const longest = phone ? 20 : 60;
    const label = (index: number) => {
      const text = bars[index]?.label ?? '';
      return text.length > longest ? `${text.slice(0, longest - 1).trimEnd()}…` : text;
    };
    return {
      indexAxis: 'y',
      responsive: true,
      maintainAspectRatio: false,
      animation: false,
      scales: {
        x: {
          title: { display: true, text: 'Watts (W)', color: palette.text },
          ticks: { color: palette.text, maxTicksLimit: phone ? 4 : 11 },
          grid: { color: palette.grid },
        },
        // The full name is in the tooltip and in the table below.
        y: { ticks: { color: palette.text, autoSkip: false, callback: (_value, index) => label(index) }, grid: { display: false } },
      },
      plugins: {
        legend: { position: 'top', labels: { color: palette.text } },
        tooltip: { callbacks: { footer: (items) => (items[0] ? bars[items[0].dataIndex]?.words : '') ?? '' } },
      },
    };
  });

  constructor() {
    afterNextRender(() => this.palette.set(themePalette(document.body)));
  }
}
