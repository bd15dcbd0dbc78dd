import type { BedWrite } from "@/db/beds";
import { polygonArea, polygonCentroid, rectangleArea } from "@/lib/calc/area";
import type { BedShape } from "@/lib/beds/view";

/** A bed shape and pin as the columns they are stored in, area and centre worked out. */
export function shapeColumns(shape: BedShape, location: { lat: number; lng: number } | null | undefined): Pick<BedWrite, "shape" | "area_m2" | "lat" | "lng"> {
  const area = "polygon" in shape ? polygonArea(shape.polygon) : rectangleArea(shape.length_m, shape.width_m);
  // An outline knows where it is; a rectangle is wherever the gardener put the pin.
  const where = "polygon" in shape ? polygonCentroid(shape.polygon) : (location ?? null);
  return { shape: JSON.stringify(shape), area_m2: Math.round(area * 1000) / 1000, lat: where?.lat ?? null, lng: where?.lng ?? null };
}
