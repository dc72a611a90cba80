/** What the upload routes answer: photos and logos, and a shop's motifs (the client reads them as typed here). */
import type { MotifGeometry, StoredMotifGeometry } from '../engine/motif.ts';

/** A stored photo or logo: re-encoded image and thumbnail, served under /uploads. */
export type UploadView = { id: string; kind: string; url: string; thumbnailUrl: string; width: number; height: number; bytes: number; createdAt: number };

/** A motif in a shop's list: its size and layers (no outlines), and where its SVG is served. */
export type MotifView = {
  id: string;
  name: string;
  widthMm: number;
  heightMm: number;
  layers: { id: string; colour: string | null; areaMm2: number; bboxMm: MotifGeometry['layers'][number]['bboxMm'] }[];
  svgUrl: string;
  createdAt: number;
};

/** One motif with its normalised geometry: each layer's filled outline in mm, y down. */
export type MotifDetailView = MotifView & { geometry: StoredMotifGeometry };

/** What the engine left out of an uploaded SVG, and why (shown to the seller after an upload). */
export type DroppedReport = MotifGeometry['dropped'];
