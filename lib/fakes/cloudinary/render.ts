// Renders a derived image with sharp from a stored original and parsed transformation
// steps. Crop modes follow Cloudinary's documented meaning:
//   c_scale  exact size, aspect ratio may change (one dimension given: proportional)
//   c_fit    fit inside the box, keeping aspect ratio, enlarging if needed
//   c_limit  like c_fit but never enlarges
//   c_fill   cover the box exactly, cropping the overflow at the gravity
//   c_lfill  like c_fill but never enlarges

import sharp, { type CreateRaw, type ResizeOptions, type Sharp } from "sharp";
import { MAX_IMAGE_PIXELS, type AcceptedImageFormat } from "../../media/image-limits";
import {
  MAX_DELIVERY_SIDE_PX,
  type DeliveryFormat,
  type Gravity,
  type TransformStep,
} from "./transformations";

export const CONTENT_TYPES: Record<DeliveryFormat, string> = {
  jpg: "image/jpeg",
  png: "image/png",
  webp: "image/webp",
};

// Common practice, no source: Cloudinary does not publish the numbers behind q_auto's
// levels, these give similar-looking results.
const AUTO_QUALITY = { best: 90, good: 80, eco: 70, low: 60 } as const;
const DEFAULT_QUALITY = 80;

const SHARP_GRAVITY: Record<Exclude<Gravity, "auto">, string> = {
  center: "centre",
  north: "north",
  south: "south",
  east: "east",
  west: "west",
  north_east: "northeast",
  north_west: "northwest",
  south_east: "southeast",
  south_west: "southwest",
};

/** True when the Accept header lists image/webp with a non-zero q (a wildcard does not count). */
export function acceptsWebp(accept: string | undefined): boolean {
  return (accept ?? "").split(",").some((entry) => {
    const [type, ...params] = entry.split(";").map((p) => p.trim().toLowerCase());
    if (type !== "image/webp") return false;
    const q = params.find((p) => p.startsWith("q="));
    return q === undefined || Number(q.slice(2)) > 0;
  });
}

export interface FormatChoice {
  /** The format the URL asks for before f_auto is resolved. */
  requested: DeliveryFormat | "auto";
  /** Whether the answer depends on the Accept header (then send Vary: Accept). */
  variesByAccept: boolean;
}

/** Last f_ component wins, then the URL's extension, then the stored format. */
export function requestedFormat(
  steps: TransformStep[],
  extension: DeliveryFormat | undefined,
  stored: AcceptedImageFormat,
): FormatChoice {
  const fromSteps = [...steps].reverse().find((s) => s.format)?.format;
  const requested = fromSteps ?? extension ?? stored;
  return { requested, variesByAccept: requested === "auto" };
}

function lastQuality(steps: TransformStep[]): number {
  const q = [...steps].reverse().find((s) => s.quality !== undefined);
  if (!q) return DEFAULT_QUALITY;
  return q.quality === "auto" ? AUTO_QUALITY[q.qualityPreset ?? "good"] : (q.quality as number);
}

function scaled(n: number | undefined, dpr: number | undefined): number | undefined {
  if (n === undefined) return undefined;
  return Math.min(Math.max(1, Math.round(n * (dpr ?? 1))), MAX_DELIVERY_SIDE_PX);
}

function resizeOptions(step: TransformStep): ResizeOptions | null {
  const width = scaled(step.width, step.dpr);
  const height = scaled(step.height, step.dpr);
  if (width === undefined && height === undefined) return null;
  const position =
    step.gravity === "auto" ? sharp.strategy.attention : SHARP_GRAVITY[step.gravity ?? "center"];
  switch (step.crop ?? "scale") {
    case "scale":
      // sharp's "fill" stretches to the box even with one side missing (it keeps the
      // source's other side), so a single dimension is scaled proportionally instead.
      return { width, height, fit: width !== undefined && height !== undefined ? "fill" : "inside" };
    case "fit":
      return { width, height, fit: "inside" };
    case "limit":
      return { width, height, fit: "inside", withoutEnlargement: true };
    case "fill":
      return { width, height, fit: "cover", position };
    case "lfill":
      return { width, height, fit: "cover", position, withoutEnlargement: true };
  }
}

export interface RenderResult {
  data: Buffer;
  format: DeliveryFormat;
}

export async function renderDerived(
  source: Buffer,
  steps: TransformStep[],
  choice: FormatChoice,
  accept: string | undefined,
): Promise<RenderResult> {
  const open = (input: Buffer, raw?: CreateRaw) =>
    sharp(input, { limitInputPixels: MAX_IMAGE_PIXELS, ...(raw ? { raw } : {}) });

  let pipeline: Sharp = open(source);
  let resizedInPipeline = false;
  for (const step of steps) {
    const resize = resizeOptions(step);
    if (!resize) continue;
    // sharp applies one resize per pipeline, so a chained step starts from the pixels
    // the previous step produced.
    if (resizedInPipeline) {
      const { data, info } = await pipeline.raw().toBuffer({ resolveWithObject: true });
      pipeline = open(data, { width: info.width, height: info.height, channels: info.channels });
    }
    pipeline = pipeline.resize(resize);
    resizedInPipeline = true;
  }

  const format = await resolveFormat(choice.requested, source, accept);
  const quality = lastQuality(steps);
  pipeline =
    format === "jpg"
      ? pipeline.flatten({ background: "#ffffff" }).jpeg({ quality })
      : format === "png"
        ? pipeline.png()
        : pipeline.webp({ quality });
  return { data: await pipeline.toBuffer(), format };
}

/**
 * f_auto: WebP when the browser says it takes it; otherwise JPEG, except that an image
 * with transparency stays PNG so its background does not turn solid.
 */
async function resolveFormat(
  requested: DeliveryFormat | "auto",
  source: Buffer,
  accept: string | undefined,
): Promise<DeliveryFormat> {
  if (requested !== "auto") return requested;
  if (acceptsWebp(accept)) return "webp";
  const { hasAlpha } = await sharp(source).metadata();
  return hasAlpha ? "png" : "jpg";
}
