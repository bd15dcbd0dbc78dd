import { describe, expect, it } from "vitest";
import sharp from "sharp";
import {
  ImageRejectedError,
  MAX_IMAGE_SIDE_PX,
  MAX_UPLOAD_BYTES,
  sanitizeImage,
  type ImageRejectedCode,
} from "@/lib/media/sanitize-image";
import { findImageEnd } from "@/lib/media/image-sniff";
import {
  exifHasGps,
  HTML,
  HTML_PAYLOAD,
  jpegRotatedByExif,
  jpegWithPrivateMetadata,
  noisy,
  pngClaimingSize,
  solid,
  SVG,
  withJpegComment,
} from "./image-fixtures";

async function rejection(buf: Buffer, opts?: Parameters<typeof sanitizeImage>[1]): Promise<ImageRejectedError> {
  try {
    await sanitizeImage(buf, opts);
  } catch (err) {
    expect(err).toBeInstanceOf(ImageRejectedError);
    return err as ImageRejectedError;
  }
  throw new Error("expected sanitizeImage to reject");
}

describe("sanitizeImage: accepted formats", () => {
  it.each([
    ["jpg", () => solid(64, 48).jpeg().toBuffer()],
    ["png", () => solid(64, 48).png().toBuffer()],
    ["webp", () => solid(64, 48).webp().toBuffer()],
  ] as const)("re-encodes a %s in its own format", async (format, make) => {
    const out = await sanitizeImage(await make());
    expect(out.format).toBe(format);
    expect([out.width, out.height]).toEqual([64, 48]);
    expect(out.bytes).toBe(out.data.length);
    const meta = await sharp(out.data).metadata();
    expect(meta.format).toBe(format === "jpg" ? "jpeg" : format);
  });

  it("keeps transparency in a PNG", async () => {
    const png = await sharp({ create: { width: 8, height: 8, channels: 4, background: { r: 0, g: 0, b: 0, alpha: 0 } } })
      .png()
      .toBuffer();
    const out = await sanitizeImage(png);
    expect((await sharp(out.data).metadata()).hasAlpha).toBe(true);
  });
});

describe("sanitizeImage: metadata", () => {
  it("drops EXIF (incl. GPS), XMP and ICC that the input carried", async () => {
    const input = await jpegWithPrivateMetadata();
    const before = await sharp(input).metadata();
    // Guard: the fixture really carries what we claim to strip.
    expect(exifHasGps(before.exif)).toBe(true);
    expect(before.xmp?.length).toBeGreaterThan(0);
    expect(before.icc?.length).toBeGreaterThan(0);

    const out = await sanitizeImage(input);
    const after = await sharp(out.data).metadata();
    expect(after.exif).toBeUndefined();
    expect(after.xmp).toBeUndefined();
    expect(after.icc).toBeUndefined();
    expect(after.iptc).toBeUndefined();
    expect(out.data.includes(Buffer.from("DuffbankTestCam"))).toBe(false);
    expect(out.data.includes(Buffer.from("Test Person"))).toBe(false);
  });

  it("applies the EXIF orientation to the pixels, then drops the tag", async () => {
    const input = await jpegRotatedByExif(60, 40);
    expect((await sharp(input).metadata()).orientation).toBe(6);
    const out = await sanitizeImage(input);
    expect([out.width, out.height]).toEqual([40, 60]);
    expect((await sharp(out.data).metadata()).orientation).toBeUndefined();
  });
});

describe("sanitizeImage: refusals by content", () => {
  const cases: Array<[string, () => Promise<Buffer> | Buffer, ImageRejectedCode]> = [
    ["an SVG", () => SVG, "not_an_image"],
    ["an SVG with a byte-order mark and leading whitespace", () => Buffer.concat([Buffer.from("\ufeff  \n"), SVG]), "not_an_image"],
    ["an HTML page (whatever it is named)", () => HTML, "not_an_image"],
    ["HTML placed before a JPEG", async () => Buffer.concat([HTML_PAYLOAD, await solid(16, 16).jpeg().toBuffer()]), "not_an_image"],
    ["a GIF", () => solid(16, 16).gif().toBuffer(), "unsupported_format"],
    ["a TIFF", () => solid(16, 16).tiff().toBuffer(), "unsupported_format"],
    ["an AVIF", () => solid(16, 16).avif().toBuffer(), "unsupported_format"],
    ["a PDF", () => Buffer.from("%PDF-1.7\n%\xe2\xe3\xcf\xd3\n"), "unsupported_format"],
    ["random bytes", () => Buffer.from(Array.from({ length: 256 }, (_, i) => (i * 37 + 11) % 256)), "not_an_image"],
    ["an empty file", () => Buffer.alloc(0), "not_an_image"],
  ];

  it.each(cases)("refuses %s", async (_name, make, code) => {
    const err = await rejection(await make());
    expect(err.code).toBe(code);
    expect(err.message.length).toBeGreaterThan(10);
  });

  it("names the refused format in the message", async () => {
    const err = await rejection(await solid(16, 16).gif().toBuffer());
    expect(err.message).toMatch(/GIF/);
  });
});

describe("sanitizeImage: polyglots", () => {
  it.each([
    ["JPEG", () => solid(32, 32).jpeg().toBuffer()],
    ["PNG", () => solid(32, 32).png().toBuffer()],
    ["WebP", () => solid(32, 32).webp().toBuffer()],
  ] as const)("refuses a %s with HTML/script appended after its end marker", async (_name, make) => {
    const err = await rejection(Buffer.concat([await make(), HTML_PAYLOAD]));
    expect(err.code).toBe("not_an_image");
    expect(err.message).toMatch(/script/i);
  });

  it("refuses a JPEG with a bare <svg onload> text trailer", async () => {
    const trailer = Buffer.from('\n<svg/onload=alert(1)>\n');
    const err = await rejection(Buffer.concat([await solid(32, 32).jpeg().toBuffer(), trailer]));
    expect(err.code).toBe("not_an_image");
  });

  it("neutralises a binary trailer (e.g. a phone's motion-photo movie clip): accepted, trailer gone", async () => {
    const jpeg = await noisy(64, 64).jpeg().toBuffer();
    const trailer = Buffer.from(Array.from({ length: 4096 }, (_, i) => (i * 131 + 7) % 256));
    const out = await sanitizeImage(Buffer.concat([jpeg, trailer]));
    expect(findImageEnd(out.data, "jpg")).toBe(out.data.length);
    expect(out.data.includes(trailer.subarray(0, 64))).toBe(false);
  });

  it("neutralises markup hidden in a JPEG comment segment: accepted, comment gone", async () => {
    const jpeg = withJpegComment(await solid(32, 32).jpeg().toBuffer(), "<script>alert(1)</script>");
    expect(jpeg.includes(Buffer.from("<script>"))).toBe(true);
    const out = await sanitizeImage(jpeg);
    expect(out.data.includes(Buffer.from("<script>"))).toBe(false);
  });
});

describe("sanitizeImage: size limits", () => {
  it("refuses a file over MAX_UPLOAD_BYTES before decoding it", async () => {
    const jpeg = await solid(16, 16).jpeg().toBuffer();
    const big = Buffer.concat([jpeg, Buffer.alloc(MAX_UPLOAD_BYTES + 1 - jpeg.length)]);
    const err = await rejection(big);
    expect(err.code).toBe("too_large");
    expect(err.message).toMatch(/10 MB/);
  });

  it("accepts a file of exactly MAX_UPLOAD_BYTES (zero padding is not a payload)", async () => {
    const jpeg = await solid(16, 16).jpeg().toBuffer();
    const exact = Buffer.concat([jpeg, Buffer.alloc(MAX_UPLOAD_BYTES - jpeg.length)]);
    await expect(sanitizeImage(exact)).resolves.toMatchObject({ format: "jpg" });
  });

  it("honours a smaller maxBytes option", async () => {
    const jpeg = await noisy(200, 200).jpeg().toBuffer();
    expect((await rejection(jpeg, { maxBytes: 1000 })).code).toBe("too_large");
  });

  it("refuses a side longer than MAX_IMAGE_SIDE_PX", async () => {
    const png = await solid(MAX_IMAGE_SIDE_PX + 1, 4).png().toBuffer();
    expect((await rejection(png)).code).toBe("too_many_pixels");
  });

  it("refuses more than 40 megapixels even when each side is allowed", async () => {
    const png = await solid(7000, 6000).png().toBuffer(); // 42 MP, sides under 8000
    expect((await rejection(png)).code).toBe("too_many_pixels");
  });

  it("refuses a tiny file whose header claims 50000 × 50000 (decompression bomb)", async () => {
    const bomb = pngClaimingSize(await solid(4, 4).png().toBuffer(), 50_000, 50_000);
    expect(bomb.length).toBeLessThan(200);
    const err = await rejection(bomb);
    expect(err.code).toBe("too_many_pixels");
    expect(err.message).toMatch(/50000 × 50000/);
  });
});

describe("sanitizeImage: damaged files", () => {
  it("refuses a truncated JPEG as corrupt", async () => {
    const jpeg = await noisy(128, 128).jpeg().toBuffer();
    const err = await rejection(jpeg.subarray(0, Math.floor(jpeg.length / 2)));
    expect(err.code).toBe("corrupt");
  });

  it("refuses a PNG whose header is broken as corrupt", async () => {
    const png = Buffer.from(await solid(8, 8).png().toBuffer());
    png.fill(0, 16, 40);
    expect((await rejection(png)).code).toBe("corrupt");
  });
});
