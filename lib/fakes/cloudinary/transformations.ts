// Parses the transformation part of a Cloudinary delivery URL, e.g.
// "c_fill,w_200,h_100,g_auto/f_auto/q_auto". Each "/"-separated segment is one step,
// applied in order; within a step the order of components does not matter. Only the
// subset Duffbank uses is supported; anything else is refused with 400 so a typo in app
// code shows up locally instead of silently rendering the original.

export type Crop = "scale" | "fit" | "limit" | "fill" | "lfill";
export type Gravity =
  | "auto" | "center" | "north" | "south" | "east" | "west"
  | "north_east" | "north_west" | "south_east" | "south_west";
export type DeliveryFormat = "jpg" | "png" | "webp";

export interface TransformStep {
  width?: number;
  height?: number;
  crop?: Crop;
  gravity?: Gravity;
  /** 1–100, or "auto" (resolved when encoding). */
  quality?: number | "auto";
  qualityPreset?: "best" | "good" | "eco" | "low";
  format?: DeliveryFormat | "auto";
  dpr?: number;
}

/** Largest side the fake renders. Product choice: covers next/image's largest default
 * device size (3840) with room to spare; larger requests are clamped, not refused. */
export const MAX_DELIVERY_SIDE_PX = 4096;

const MAX_DPR = 4;

export class TransformationError extends Error {
  constructor(message: string) {
    super(message);
    this.name = "TransformationError";
  }
}

const CROPS = new Set<Crop>(["scale", "fit", "limit", "fill", "lfill"]);
const GRAVITIES = new Set<Gravity>([
  "auto", "center", "north", "south", "east", "west", "north_east", "north_west", "south_east", "south_west",
]);
const FORMATS: Record<string, DeliveryFormat> = { jpg: "jpg", jpeg: "jpg", png: "png", webp: "webp" };

/** Maps a file extension or f_ value to an output format, or undefined if unsupported. */
export function deliveryFormat(name: string): DeliveryFormat | undefined {
  return FORMATS[name.toLowerCase()];
}

// A component is a short lowercase key, "_", then a value: w_200, c_fill, q_auto:good.
const COMPONENT = /^([a-z]{1,3})_(.+)$/;

/**
 * Whether a path segment is written like a transformation. Used only when a URL has no
 * version segment to mark where transformations end; folder names in this app never
 * look like "x_y", so the ambiguity does not arise in practice.
 */
export function looksLikeTransformation(segment: string): boolean {
  return segment.length > 0 && segment.split(",").every((part) => COMPONENT.test(part));
}

function positiveInt(key: string, value: string): number {
  if (!/^\d{1,6}$/.test(value) || Number(value) === 0) {
    throw new TransformationError(`Invalid ${key} value ${value}: expected a whole number of pixels`);
  }
  return Math.min(Number(value), MAX_DELIVERY_SIDE_PX);
}

export function parseTransformation(segment: string): TransformStep {
  const step: TransformStep = {};
  for (const part of segment.split(",")) {
    const m = COMPONENT.exec(part);
    if (!m) throw new TransformationError(`Invalid transformation component - ${part}`);
    const [, key, value] = m;
    switch (key) {
      case "w":
        step.width = positiveInt("width", value);
        break;
      case "h":
        step.height = positiveInt("height", value);
        break;
      case "c":
        if (!CROPS.has(value as Crop)) throw new TransformationError(`Unsupported crop mode c_${value}`);
        step.crop = value as Crop;
        break;
      case "g": {
        // g_auto:subject and similar variants all mean "let the service choose".
        const g = value.startsWith("auto") ? "auto" : value;
        if (!GRAVITIES.has(g as Gravity)) throw new TransformationError(`Unsupported gravity g_${value}`);
        step.gravity = g as Gravity;
        break;
      }
      case "q": {
        const preset = /^auto(?::(best|good|eco|low))?$/.exec(value);
        if (preset) {
          step.quality = "auto";
          step.qualityPreset = (preset[1] as TransformStep["qualityPreset"]) ?? "good";
        } else if (/^\d{1,3}$/.test(value) && Number(value) >= 1 && Number(value) <= 100) {
          step.quality = Number(value);
        } else {
          throw new TransformationError(`Invalid quality q_${value}`);
        }
        break;
      }
      case "f": {
        const f = value === "auto" ? "auto" : deliveryFormat(value);
        if (!f) throw new TransformationError(`Unsupported format f_${value}`);
        step.format = f;
        break;
      }
      case "dpr": {
        const dpr = Number(value);
        if (!/^\d+(\.\d+)?$/.test(value) || dpr <= 0 || dpr > MAX_DPR) {
          throw new TransformationError(`Invalid dpr_${value}`);
        }
        step.dpr = dpr;
        break;
      }
      default:
        throw new TransformationError(`Invalid transformation component - ${part}`);
    }
  }
  return step;
}

export function parseTransformations(segments: string[]): TransformStep[] {
  return segments.map(parseTransformation);
}
