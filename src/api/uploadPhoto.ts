import { apiRequest } from './request';

/** Uploads a photo of the target for a ruling; photos need signal (rulings do not). */
export async function uploadPhoto(eventId: number, file: File): Promise<{ photoId: number }> {
  const body = new FormData();
  body.append('photo', file);
  return apiRequest<{ photoId: number }>(`/api/events/${eventId}/photos`, { method: 'POST', body });
}
