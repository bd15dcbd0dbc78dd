export interface LatLng {
  lat: number;
  lng: number;
}

export interface MapMarker extends LatLng {
  id: string;
  label?: string;
  /** A visiting order number drawn on the marker. */
  order?: number;
  tone?: "listing" | "origin" | "selected";
  onSelect?: () => void;
  /** Class on the marker's SVG path, so a page (or a test) can find a listing's marker. */
  className?: string;
}

/** A shaded rectangle: a demand cell, darker the more people are behind it. */
export interface MapArea {
  id: string;
  south: number;
  west: number;
  north: number;
  east: number;
  /** 0–1: how strongly to shade it. */
  intensity: number;
  label: string;
}

export interface MapProps {
  center: LatLng;
  zoom?: number;
  markers?: MapMarker[];
  /** A drawn outline (vertices in order); closed when it has three or more. */
  polygon?: LatLng[];
  /** Shaded rectangles under the markers (the council's demand map). */
  areas?: MapArea[];
  /** A route drawn as straight segments. */
  line?: LatLng[];
  onClick?: (p: LatLng) => void;
  /** Points the view should fit when they change. */
  fitTo?: LatLng[];
  /** Where the view should go when this changes (a place found by name). */
  view?: LatLng & { zoom?: number };
  /**
   * Drawing without a mouse: a cross in the middle of the map and a button that places a
   * point there. Arrow keys move the map (once it has the focus), + and − zoom.
   */
  centrePick?: { label: string; onPick: (p: LatLng) => void };
  /** Accessible name of the map region. */
  label: string;
  className?: string;
}

export { DEFAULT_CENTER } from "@/lib/geo/default-center";
