export type CaughtMailSummary = { id: number; from: string; to: string; subject: string; receivedAt: string };
export type CaughtMailMessage = CaughtMailSummary & {
  text: string;
  attachments: { index: number; filename: string; contentType: string; size: number }[];
};
