import { describe, expect, it } from 'vitest';
import { controlChanges } from '../../service/src/compliance/comparison.js';
import type { ControlLine, EvaluationResult } from '../../service/src/compliance/index.js';

// Invented spaces and lines: only the requirements and statuses matter here, not what the tables hold.
function line(
  strategy: ControlLine['strategy'],
  label: string,
  requirement: ControlLine['requirement'],
  status: ControlLine['status'],
): ControlLine {
  return { strategy, label, requirement, status, met: null, reason: '', section: '§', verified: true };
}

function result(
  spaces: { id: string; name: string; controls: ControlLine[] }[],
  exterior: { key: string; label: string; controls: ControlLine[] }[] = [],
): EvaluationResult {
  return {
    interior: { spaces },
    exterior: exterior.length > 0 ? { applications: exterior } : null,
  } as unknown as EvaluationResult;
}

describe('controlChanges', () => {
  it('names each control whose requirement differs, on the space it belongs to, and nothing else', () => {
    const own = result([
      {
        id: 's1',
        name: 'Reading room',
        controls: [
          line('occupant-sensor', 'Occupant sensor', 'required', 'met'),
          line('time-switch', 'Time-switch control', 'required', 'met'),
        ],
      },
      { id: 's2', name: 'Stair', controls: [line('time-switch', 'Time-switch control', 'required', 'met')] },
    ]);
    const other = result([
      {
        id: 's1',
        name: 'Reading room',
        controls: [
          line('automatic-full-off', 'Automatic full OFF', 'required', 'not-met'),
          line('time-switch', 'Time-switch control', 'one-of:ADD1', 'met'),
        ],
      },
      { id: 's2', name: 'Stair', controls: [line('time-switch', 'Time-switch control', 'required', 'met')] },
    ]);
    expect(controlChanges(own, other)).toEqual([
      {
        place: 'Reading room',
        exterior: false,
        changes: [
          { control: 'Automatic full OFF', requirement: 'required', before: 'not-required', status: 'not-met', section: '§' },
          // A line the other edition does not list for the space is not required there.
          { control: 'Occupant sensor', requirement: 'not-required', before: 'required', status: 'not-required', section: '§' },
        ],
      },
    ]);
  });

  it('keeps a requirement the data cannot settle "to verify", on either side', () => {
    const own = result([
      {
        id: 's1',
        name: 'Lobby',
        controls: [
          line('local-control', 'Local control', 'not-required', 'not-required'),
          line('bilevel', 'Bilevel lighting control', 'to-verify', 'to-verify'),
        ],
      },
    ]);
    const other = result([
      {
        id: 's1',
        name: 'Lobby',
        controls: [
          line('local-control', 'Local control', 'to-verify', 'to-verify'),
          line('bilevel', 'Bilevel lighting control', 'required', 'met'),
        ],
      },
    ]);
    expect(controlChanges(own, other)[0]!.changes).toEqual([
      { control: 'Local control', requirement: 'to-verify', before: 'not-required', status: 'to-verify', section: '§' },
      { control: 'Bilevel lighting control', requirement: 'required', before: 'to-verify', status: 'met', section: '§' },
    ]);
  });

  it('matches exterior applications by their key and marks them as exterior', () => {
    const own = result(
      [],
      [
        {
          key: 'parking',
          label: 'Parking lots',
          controls: [line('exterior-setback', 'Exterior lighting setback', 'not-required', 'not-required')],
        },
      ],
    );
    const other = result(
      [],
      [{ key: 'parking', label: 'Parking lots', controls: [line('exterior-setback', 'Exterior lighting setback', 'required', 'not-met')] }],
    );
    expect(controlChanges(own, other)).toEqual([
      {
        place: 'Parking lots',
        exterior: true,
        changes: [
          { control: 'Exterior lighting setback', requirement: 'required', before: 'not-required', status: 'not-met', section: '§' },
        ],
      },
    ]);
  });
});
