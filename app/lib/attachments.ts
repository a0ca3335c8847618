// Attachment limits and the row the pages show (pure; attachments.server.ts keeps the files).
export const ATTACHMENT_MAX_BYTES = 5 * 1024 * 1024;
export const ATTACHMENTS_PER_OPTION = 20;
export const TEAM_ATTACHMENT_BYTES = 500 * 1024 * 1024;
export const ATTACHMENT_NAME_MAX = 120;
export type AttachmentType = "image/png" | "image/jpeg" | "image/webp" | "application/pdf";
/** for the file input's accept attribute (a hint only: the server tells the type by the content) */
export const ATTACHMENT_ACCEPT = ".png,.jpg,.jpeg,.webp,.pdf,image/png,image/jpeg,image/webp,application/pdf";

export interface AttachmentRow {
  id: number;
  optionId: number;
  fileName: string;
  contentType: AttachmentType;
  sizeBytes: number;
  createdBy: string | null;
  createdById: number | null;
  createdAt: string;
}

export function sizeInWords(bytes: number): string {
  return bytes < 1024 ? `${bytes} B` : bytes < 1024 * 1024 ? `${(bytes / 1024).toFixed(0)} kB` : `${(bytes / 1024 / 1024).toFixed(1)} MB`;
}
