/** `GET /api/me/cards`: the signed-in archer's scorecards. */
export type MyCard = {
  entryId: number;
  sessionId: number;
  eventName: string;
  sessionName: string;
  division: string;
  targetNumber: number;
  position: 'A' | 'B' | 'C' | 'D';
};
