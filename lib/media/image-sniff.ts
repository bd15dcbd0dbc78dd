// Content sniffing for uploads. The file name and the Content-Type a browser sends are
// chosen by the uploader, so neither is trusted: only the bytes decide what a file is.
// Pure: no sharp, no I/O, so it is cheap to run before any decoding.

import type { AcceptedImageFormat } from "./image-limits";

export type SniffResult =
  | { kind: "image"; format: AcceptedImageFormat }
  | { kind: "unsupported"; name: string }
  | { kind: "markup" }
  | { kind: "unknown" };

function startsWith(buf: Buffer, bytes: number[], offset = 0): boolean {
  if (buf.length < offset + bytes.length) return false;
  return bytes.every((b, i) => buf[offset + i] === b);
}

function ascii(buf: Buffer, start: number, end: number): string {
  return buf.length >= end ? buf.toString("latin1", start, end) : "";
}

// Signatures from each format's specification (JPEG: ITU T.81 SOI + marker; PNG: RFC 2083
// §3.1; WebP: Google's RIFF container spec; the others from their own specs).
export function sniffImage(buf: Buffer): SniffResult {
  if (startsWith(buf, [0xff, 0xd8, 0xff])) return { kind: "image", format: "jpg" };
  if (startsWith(buf, [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a])) {
    return { kind: "image", format: "png" };
  }
  if (ascii(buf, 0, 4) === "RIFF" && ascii(buf, 8, 12) === "WEBP") {
    return { kind: "image", format: "webp" };
  }

  const head4 = ascii(buf, 0, 4);
  if (head4 === "GIF8") return { kind: "unsupported", name: "GIF" };
  if (head4 === "%PDF") return { kind: "unsupported", name: "PDF" };
  if (head4 === "8BPS") return { kind: "unsupported", name: "Photoshop" };
  if (startsWith(buf, [0x49, 0x49, 0x2a, 0x00]) || startsWith(buf, [0x4d, 0x4d, 0x00, 0x2a])) {
    return { kind: "unsupported", name: "TIFF" };
  }
  if (ascii(buf, 0, 2) === "BM") return { kind: "unsupported", name: "BMP" };
  if (startsWith(buf, [0x00, 0x00, 0x01, 0x00])) return { kind: "unsupported", name: "icon" };
  if (startsWith(buf, [0xff, 0x0a]) || ascii(buf, 4, 8) === "JXL ") {
    return { kind: "unsupported", name: "JPEG XL" };
  }
  if (ascii(buf, 4, 8) === "ftyp") {
    const brand = ascii(buf, 8, 12);
    if (/^(heic|heix|hevc|heim|heis|mif1|msf1)$/.test(brand)) return { kind: "unsupported", name: "HEIC" };
    if (/^avi[fs]$/.test(brand)) return { kind: "unsupported", name: "AVIF" };
    return { kind: "unsupported", name: "MP4 or MOV movie" };
  }

  if (looksLikeMarkupDocument(buf)) return { kind: "markup" };
  return { kind: "unknown" };
}

// SVG, HTML and XML all open with "<" once an optional byte-order mark and whitespace are
// skipped; that is enough to name the refusal helpfully.
function looksLikeMarkupDocument(buf: Buffer): boolean {
  let text = buf.toString("utf8", 0, Math.min(buf.length, 512));
  if (text.charCodeAt(0) === 0xfeff) text = text.slice(1);
  return /^\s*</.test(text);
}

/**
 * Byte offset just past the image's own end marker, or null when the structure cannot be
 * walked (the decoder then decides whether the file is corrupt). Bytes after this offset
 * are not part of the picture.
 */
export function findImageEnd(buf: Buffer, format: AcceptedImageFormat): number | null {
  switch (format) {
    case "jpg":
      return jpegEnd(buf);
    case "png":
      return pngEnd(buf);
    case "webp":
      return webpEnd(buf);
  }
}

// JPEG (ITU T.81 Annex B): segments carry a 2-byte length, except standalone markers
// (RSTn, TEM). After SOS comes entropy-coded data in which 0xFF is always followed by a
// stuffed 0x00 or a restart marker, so the next other marker ends the scan. EXIF
// thumbnails live inside APP1 and are skipped by its length, so their EOI is never hit.
function jpegEnd(buf: Buffer): number | null {
  let i = 2;
  while (i < buf.length) {
    if (buf[i] !== 0xff) return null;
    while (i < buf.length && buf[i] === 0xff) i++;
    if (i >= buf.length) return null;
    const marker = buf[i++];
    if (marker === 0xd9) return i;
    if ((marker >= 0xd0 && marker <= 0xd7) || marker === 0x01) continue;
    if (i + 2 > buf.length) return null;
    const length = buf.readUInt16BE(i);
    if (length < 2) return null;
    i += length;
    if (marker !== 0xda) continue;
    for (;;) {
      const ff = buf.indexOf(0xff, i);
      if (ff === -1 || ff + 1 >= buf.length) return null;
      const next = buf[ff + 1];
      if (next === 0x00 || (next >= 0xd0 && next <= 0xd7)) {
        i = ff + 2;
        continue;
      }
      i = ff;
      break;
    }
  }
  return null;
}

// PNG (RFC 2083 §3.2): length(4) type(4) data crc(4), ending with the IEND chunk.
function pngEnd(buf: Buffer): number | null {
  let i = 8;
  while (i + 12 <= buf.length) {
    const length = buf.readUInt32BE(i);
    const type = buf.toString("latin1", i + 4, i + 8);
    i += 12 + length;
    if (type === "IEND") return i <= buf.length ? i : null;
  }
  return null;
}

// RIFF: the little-endian size at offset 4 counts everything after the first 8 bytes;
// chunks are padded to an even length.
function webpEnd(buf: Buffer): number | null {
  if (buf.length < 12) return null;
  const size = buf.readUInt32LE(4);
  const end = 8 + size + (size & 1);
  return end <= buf.length ? end : null;
}

export type TrailerKind = "none" | "padding" | "markup" | "binary";

// Signatures long enough that random compressed bytes essentially never contain them
// (a 5+ byte, case-insensitive match in a few megabytes of noise is around 1 in 10^4 or
// rarer), so binary trailers such as a phone's embedded motion-photo movie clip pass.
const SCRIPT_SIGNATURES = [
  "<script", "<html", "<!doctype", "<?php", "<iframe", "<object", "<embed", "<body",
  "<svg ", "<svg>", "<?xml", "javascript:", "<%@", "<jsp:",
];

/** What follows the image's end marker. Markup there is the classic polyglot trick. */
export function classifyTrailer(trailer: Buffer): TrailerKind {
  if (trailer.length === 0) return "none";
  if (trailer.every((b) => b === 0x00 || b === 0xff || b === 0x20 || (b >= 0x09 && b <= 0x0d))) {
    return "padding";
  }
  const text = trailer.toString("latin1").toLowerCase();
  if (SCRIPT_SIGNATURES.some((sig) => text.includes(sig))) return "markup";
  // Shorter tags (<a, <img, <svg onload=...) are only telling when the trailer is text.
  if (mostlyText(trailer) && /<[a-z!?\/]/.test(text)) return "markup";
  return "binary";
}

function mostlyText(buf: Buffer): boolean {
  const sample = buf.subarray(0, 4096);
  let printable = 0;
  for (const b of sample) if ((b >= 0x20 && b < 0x7f) || b === 0x09 || b === 0x0a || b === 0x0d) printable++;
  return printable / sample.length >= 0.9;
}
