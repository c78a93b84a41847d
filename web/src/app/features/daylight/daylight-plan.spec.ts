import { provideZonelessChangeDetection } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { DaylightPlan } from './daylight-plan';
import { planGeometry, planPadding, scaleBarLength } from './plan-geometry';

// An invented 60 ft × 40 ft room: the geometry is ours, not a code table.
const room = { length: 60, width: 40 };

describe('daylight plan geometry', () => {
  it('scales zone rectangles to the room, north up (plan y grows upward, SVG y downward)', () => {
    const plan = planGeometry(
      {
        ...room,
        windows: [],
        skylights: [],
        zones: [{ kind: 'primary-sidelit', source: 'windows.0', x: '4', y: '0', length: '16', width: '10' }],
      },
      600,
      400,
    );
    expect(plan.scale).toBe(10);
    expect(plan.room).toEqual({ x: planPadding.left, y: planPadding.top, width: 600, height: 400 });
    const zone = plan.zones[0]!;
    expect(zone).toMatchObject({ x: planPadding.left + 40, width: 160, height: 100, label: 'Primary' });
    // The zone sits on the south wall, so its bottom edge is the room's bottom edge.
    expect(zone.y + zone.height).toBe(planPadding.top + 400);
  });

  it('draws an east window on the right-hand wall, its offset from the south end', () => {
    const plan = planGeometry(
      { ...room, windows: [{ wall: 'east', width: '10', headHeight: '8', offset: '5' }], skylights: [], zones: [] },
      600,
      400,
    );
    const window = plan.windows[0]!;
    expect(window.x1).toBe(planPadding.left + 600);
    expect(window.x2).toBe(planPadding.left + 600);
    expect([window.y1, window.y2]).toEqual([planPadding.top + 350, planPadding.top + 250]);
  });

  it('centres a window with no offset, as the engine does', () => {
    const plan = planGeometry({ ...room, windows: [{ wall: 'south', width: '20', headHeight: '8' }], skylights: [], zones: [] }, 600, 400);
    expect([plan.windows[0]!.x1, plan.windows[0]!.x2]).toEqual([planPadding.left + 200, planPadding.left + 400]);
  });

  it('picks a round scale bar of about a quarter of the room', () => {
    expect(scaleBarLength(60)).toBe(10);
    expect(scaleBarLength(8)).toBe(2);
    expect(scaleBarLength(300)).toBe(50);
  });
});

describe('DaylightPlan', () => {
  it('renders each zone with its own pattern and label, the windows on their walls, and says so in words', async () => {
    TestBed.configureTestingModule({ imports: [DaylightPlan], providers: [provideZonelessChangeDetection()] });
    const fixture = TestBed.createComponent(DaylightPlan);
    fixture.componentRef.setInput('name', 'Test room');
    fixture.componentRef.setInput('length', 60);
    fixture.componentRef.setInput('width', 40);
    fixture.componentRef.setInput('windows', [{ wall: 'east', width: '10', headHeight: '8' }]);
    fixture.componentRef.setInput('zones', [
      { kind: 'primary-sidelit', source: 'windows.0', x: '52', y: '15', length: '8', width: '10' },
      { kind: 'secondary-sidelit', source: 'windows.0', x: '44', y: '15', length: '8', width: '10' },
    ]);
    await fixture.whenStable();
    const svg = (fixture.nativeElement as HTMLElement).querySelector('svg.plan')!;
    const zones = Array.from(svg.querySelectorAll('g.zone'));
    expect(zones.map((zone) => zone.getAttribute('data-kind'))).toEqual(['secondary-sidelit', 'primary-sidelit']);
    const fills = zones.map((zone) => zone.querySelector('rect')!.getAttribute('fill'));
    expect(new Set(fills).size).toBe(2);
    expect(fills.every((fill) => fill?.startsWith('url(#'))).toBe(true);
    expect(svg.querySelectorAll('g.window[data-wall="east"]')).toHaveLength(1);
    expect(svg.querySelector('desc')?.textContent).toContain('1 on the east wall');
    expect(svg.querySelector('.north-label')?.textContent).toBe('N');
  });
});
