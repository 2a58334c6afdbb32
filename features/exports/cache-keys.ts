// URLs and SWR keys of the exports feature (neutral module: imported by server and client).
export const BACKGROUND_SHEET_MIN_BOLTS = 64;
export const JOB_POLL_MS = 1000;

const base = (designId: string, number: number) => `/api/v1/designs/${designId}/revisions/${number}`;

export const sheetPdfUrl = (
  designId: string,
  number: number,
  paper: "a4" | "letter",
  units: "SI" | "US",
): string => `${base(designId, number)}/sheet.pdf?paper=${paper}&units=${units}`;
export const passLogPdfUrl = (
  designId: string,
  number: number,
  paper: "a4" | "letter",
  units: "SI" | "US",
): string => `${base(designId, number)}/pass-log.pdf?paper=${paper}&units=${units}`;
export const holeListUrl = (designId: string, number: number): string =>
  `${base(designId, number)}/holes.csv`;
export const drillingTemplateUrl = (designId: string, number: number): string =>
  `${base(designId, number)}/drilling.dxf`;
export const boltingKitUrl = (designId: string, number: number): string =>
  `${base(designId, number)}/bolting-kit.csv`;
export const passLogUrl = (designId: string, number: number): string =>
  `${base(designId, number)}/pass-log.csv`;
export const jobStatusKey = (jobId: string): string => `/api/v1/jobs/${jobId}`;
