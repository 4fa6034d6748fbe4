export type ConsentView = { granted: boolean; decidedOn: string } | null;
export type Athlete = {
  id: string;
  clubId: string;
  squadId: string | null;
  squadName: string | null;
  firstName: string;
  lastName: string;
  dateOfBirth: string;
  sex: 'female' | 'male';
  racketHand: 'left' | 'right';
  takeOffLeg: 'left' | 'right';
  archived: boolean;
  consents: { photos: ConsentView; emailSummaries: ConsentView };
};
export type SquadSummary = { id: string; name: string; athleteCount: number };
