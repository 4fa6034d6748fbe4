import { describe, expect, it } from 'vitest';
import { biggestSquadId } from './get-squads';

// Our choice: a squad screen opened without a squad in its address shows the biggest squad.
describe('biggestSquadId', () => {
  it('takes the squad with the most athletes, the first listed among equals', () => {
    const squads = [
      { id: 'a', athleteCount: 1 },
      { id: 'b', athleteCount: 12 },
      { id: 'c', athleteCount: 12 },
      { id: 'd', athleteCount: 0 },
    ];
    expect(biggestSquadId(squads)).toBe('b');
  });

  it('gives none for a club without squads', () => {
    expect(biggestSquadId([])).toBeNull();
  });
});
