/** One recorded shoot-off arrow (table shootoff_arrows; the latest row per archer and arrow counts). */
export type ShootOffArrowRow = {
  session_id: number;
  entry_id: number;
  arrow_index: number;
  value: string;
  distance_mm: number | null;
  closer: boolean;
  recorded_by: number;
  recorded_at: string;
  mutation_id: string;
};
