// Test images built at run time with sharp, so no binary blobs live in the repository.
// Shared by the media unit tests and the fake Cloudinary integration tests.

import sharp from "sharp";
import zlib from "node:zlib";

// 51°30'N 0°7'W, written as EXIF rationals (degrees, minutes, seconds).
export const GPS_EXIF = {
  IFD0: { Make: "DuffbankTestCam", Model: "Fixture 1" },
  IFD3: {
    GPSLatitudeRef: "N",
    GPSLatitude: "51/1 30/1 0/1",
    GPSLongitudeRef: "W",
    GPSLongitude: "0/1 7/1 0/1",
  },
};

export function solid(width: number, height: number, background = "#7a4a21") {
  return sharp({ create: { width, height, channels: 3, background } });
}

/** Noise compresses badly, which makes files of realistic size. */
export function noisy(width: number, height: number) {
  return sharp({
    create: { width, height, channels: 3, background: "#000", noise: { type: "gaussian", mean: 128, sigma: 40 } },
  });
}

/** A JPEG carrying GPS EXIF, an XMP packet and a Display P3 ICC profile. */
export async function jpegWithPrivateMetadata(width = 120, height = 80): Promise<Buffer> {
  return solid(width, height)
    .jpeg()
    .withExif(GPS_EXIF)
    .withXmp(
      '<x:xmpmeta xmlns:x="adobe:ns:meta/"><rdf:RDF xmlns:rdf="http://www.w3.org/1999/02/22-rdf-syntax-ns#">' +
        '<rdf:Description xmlns:dc="http://purl.org/dc/elements/1.1/"><dc:creator>Test Person</dc:creator>' +
        "</rdf:Description></rdf:RDF></x:xmpmeta>",
    )
    .withIccProfile("p3")
    .toBuffer();
}

/** A JPEG whose pixels are stored landscape with an EXIF "rotate 90° clockwise" tag (6). */
export async function jpegRotatedByExif(width = 60, height = 40): Promise<Buffer> {
  return solid(width, height).jpeg().withMetadata({ orientation: 6 }).toBuffer();
}

/**
 * True when the EXIF block has a GPS IFD pointer (tag 0x8825) in IFD0. Walks the TIFF
 * structure rather than searching for bytes, so it cannot pass by accident.
 */
export function exifHasGps(exif: Buffer | undefined): boolean {
  if (!exif) return false;
  const tiff = exif.subarray(0, 6).toString("latin1") === "Exif\0\0" ? exif.subarray(6) : exif;
  const little = tiff.toString("latin1", 0, 2) === "II";
  const u16 = (o: number) => (little ? tiff.readUInt16LE(o) : tiff.readUInt16BE(o));
  const u32 = (o: number) => (little ? tiff.readUInt32LE(o) : tiff.readUInt32BE(o));
  const ifd0 = u32(4);
  const count = u16(ifd0);
  for (let i = 0; i < count; i++) {
    if (u16(ifd0 + 2 + i * 12) === 0x8825) return true;
  }
  return false;
}

/** Inserts a JPEG COM (comment) segment right after SOI. */
export function withJpegComment(jpeg: Buffer, comment: string): Buffer {
  const body = Buffer.from(comment, "latin1");
  const header = Buffer.from([0xff, 0xfe, 0, 0]);
  header.writeUInt16BE(body.length + 2, 2);
  return Buffer.concat([jpeg.subarray(0, 2), header, body, jpeg.subarray(2)]);
}

/** Rewrites a PNG's IHDR to claim other dimensions (with a valid CRC): a decompression bomb's header. */
export function pngClaimingSize(png: Buffer, width: number, height: number): Buffer {
  const out = Buffer.from(png);
  // Signature (8) + IHDR length (4) + "IHDR" (4): width and height follow.
  out.writeUInt32BE(width, 16);
  out.writeUInt32BE(height, 20);
  out.writeUInt32BE(zlib.crc32(out.subarray(12, 29)) >>> 0, 29);
  return out;
}

export const SVG = Buffer.from(
  '<?xml version="1.0"?>\n<svg xmlns="http://www.w3.org/2000/svg" width="100" height="100">' +
    '<script>alert(document.cookie)</script><rect width="100" height="100" fill="brown"/></svg>',
);

export const HTML = Buffer.from(
  "<!DOCTYPE html>\n<html><body><script>fetch('/api/me').then(r=>r.text()).then(alert)</script></body></html>\n",
);

export const HTML_PAYLOAD = Buffer.from("<html><body><script>alert(document.domain)</script></body></html>");
