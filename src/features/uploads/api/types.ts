/** What the upload routes return (server/features/uploads/uploads.service.ts). */
export type UploadedPhoto = { id: string; kind: string; url: string; thumbnailUrl: string; width: number; height: number; bytes: number; createdAt: number };
export type BBox = { minX: number; minY: number; maxX: number; maxY: number };
export type MotifSummary = {
  id: string;
  name: string;
  widthMm: number;
  heightMm: number;
  layers: { id: string; colour: string | null; areaMm2: number; bboxMm: BBox }[];
  svgUrl: string;
  createdAt: number;
};
/** One motif with its normalised geometry: each layer's filled outline in mm, y down. */
export type MotifDetail = MotifSummary & { geometry: { widthMm: number; heightMm: number; layers: { id: string; colour: string | null; path: string }[] } };
export type DroppedReport = { what: string; reason: string; count: number }[];
