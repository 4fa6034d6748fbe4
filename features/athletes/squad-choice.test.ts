import { describe, expect, it } from 'vitest';
import { defaultSquadId } from './squad-choice';

// Our choice: a squad screen opens on the squad last chosen on the device, else the biggest squad.
describe('defaultSquadId', () => {
  const squads = [
    { id: 'a', athleteCount: 1 },
    { id: 'b', athleteCount: 12 },
    { id: 'c', athleteCount: 12 },
    { id: 'd', athleteCount: 0 },
  ];

  it('takes the squad last chosen when the club still lists it', () => {
    expect(defaultSquadId(squads, 'd')).toBe('d');
  });

  it('otherwise the biggest squad, the first listed among equals', () => {
    expect(defaultSquadId(squads, null)).toBe('b');
    expect(defaultSquadId(squads, 'gone')).toBe('b');
  });

  it('gives none for a club without squads', () => {
    expect(defaultSquadId([], 'a')).toBeNull();
  });
});
