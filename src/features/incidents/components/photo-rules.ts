import { MAX_INCIDENT_PHOTOS, MAX_PHOTO_BYTES, photoTypes } from '../../../../shared/incidents/vocabulary';
import { formatFileSize } from '../../../lib/format';

/** The server's photo limits, checked in the browser first so a person on a slow link learns before uploading. */
export const MAX_PHOTOS = MAX_INCIDENT_PHOTOS;
export { MAX_PHOTO_BYTES };
export const PHOTO_ACCEPT = [...photoTypes, '.heic'].join(',');
const acceptedTypes: readonly string[] = photoTypes;

export const isHeic = (file: { type: string; name: string }) => /heic|heif/i.test(file.type) || /\.(heic|heif)$/i.test(file.name);

/** A plain sentence for a photo the server would refuse, or null when it is fine. */
export function photoProblem(file: File): string | null {
  if (!acceptedTypes.includes(file.type) && !isHeic(file)) return `“${file.name}” is not a JPEG, PNG or HEIC photo.`;
  if (file.size > MAX_PHOTO_BYTES)
    return `“${file.name}” is ${formatFileSize(file.size)}; each photo may be at most ${MAX_PHOTO_BYTES / 1024 / 1024} MB. Take it again at a lower resolution.`;
  return null;
}
