// SWR keys of attachment lists (neutral module: used by the panel and by anything that uploads).
export const attachmentsKey = (designId: string) => `/api/v1/designs/${designId}/attachments`;
export const attachmentUrl = (designId: string, attachmentId: string) =>
  `/api/v1/designs/${designId}/attachments/${attachmentId}`;
