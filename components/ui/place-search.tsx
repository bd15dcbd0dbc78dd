"use client";
import { forwardRef, useEffect, useId, useRef, useState, type KeyboardEvent } from "react";
import { apiFetch } from "@/lib/api/client";
import type { Place } from "@/lib/validation/places";

/** A place someone chose: a point and what to call it. Nobody types coordinates. */
export interface ChosenPlace {
  lat: number;
  lng: number;
  label: string;
}

interface PlaceSearchProps {
  /** The visible label; the input's id is `field-${name}`, so error summaries can link to it. */
  label: string;
  name: string;
  hint?: string;
  value: ChosenPlace | null;
  onChange: (place: ChosenPlace) => void;
  error?: string;
  /** Offer "Use where I am" (the browser asks first; the app's Permissions-Policy allows it). */
  allowHere?: boolean;
  /** Bias the search towards a point (the map's centre). */
  near?: { lat: number; lng: number };
}

const DEBOUNCE_MS = 200;

/**
 * Type a town, village, street or postcode and pick from the list (an ARIA combobox: arrow
 * keys move, Enter picks, Escape closes), or use the device's position. Answers come from
 * GET /api/places; the chosen place is said back in words.
 */
export const PlaceSearch = forwardRef<HTMLInputElement, PlaceSearchProps>(function PlaceSearch({ label, name, hint, value, onChange, error, allowHere = true, near }, ref) {
  const inputId = `field-${name}`;
  const listId = useId();
  const [text, setText] = useState(value?.label ?? "");
  const [places, setPlaces] = useState<Place[]>([]);
  const [open, setOpen] = useState(false);
  const [active, setActive] = useState(-1);
  const [status, setStatus] = useState("");
  const typed = useRef(false);

  // The chosen place shows in the box when it changes from outside (a map click, a reset).
  useEffect(() => {
    if (!typed.current) setText(value?.label ?? "");
  }, [value?.label]);

  useEffect(() => {
    if (!typed.current) return;
    const q = text.trim();
    if (q.length < 2) {
      setPlaces([]);
      setOpen(false);
      setStatus("");
      return;
    }
    const ctrl = new AbortController();
    const timer = setTimeout(async () => {
      const params = new URLSearchParams({ q, limit: "8", ...(near ? { lat: String(near.lat), lng: String(near.lng) } : {}) });
      try {
        const { places: found } = await apiFetch<{ places: Place[] }>(`/api/places?${params}`, { signal: ctrl.signal });
        setPlaces(found);
        setOpen(true);
        setActive(found.length ? 0 : -1);
        setStatus(found.length ? `${found.length} ${found.length === 1 ? "place" : "places"} found: use the arrow keys and Enter to choose.` : "No place by that name here. Try a street, a village or a postcode.");
      } catch {
        if (!ctrl.signal.aborted) setStatus("Place search is not answering just now. Try again in a moment.");
      }
    }, DEBOUNCE_MS);
    return () => {
      clearTimeout(timer);
      ctrl.abort();
    };
  }, [text, near?.lat, near?.lng]); // eslint-disable-line react-hooks/exhaustive-deps

  const choose = (p: Place) => {
    typed.current = false;
    setText(p.label);
    setOpen(false);
    setPlaces([]);
    setStatus(`Chosen: ${p.label}.`);
    onChange({ lat: p.lat, lng: p.lng, label: p.label });
  };

  const onKeyDown = (e: KeyboardEvent<HTMLInputElement>) => {
    if (e.key === "ArrowDown" || e.key === "ArrowUp") {
      if (!places.length) return;
      e.preventDefault();
      setOpen(true);
      setActive((i) => (e.key === "ArrowDown" ? (i + 1) % places.length : (i - 1 + places.length) % places.length));
    } else if (e.key === "Enter") {
      // Picking a place never submits the form around it.
      if (open && active >= 0 && places[active]) {
        e.preventDefault();
        choose(places[active]);
      } else if (typed.current && text.trim()) {
        e.preventDefault();
      }
    } else if (e.key === "Escape" && open) {
      e.preventDefault();
      setOpen(false);
    }
  };

  const useHere = () => {
    if (!("geolocation" in navigator)) return setStatus("This browser cannot tell where you are: type a place instead.");
    setStatus("Finding where you are…");
    navigator.geolocation.getCurrentPosition(
      async (pos) => {
        const lat = Math.round(pos.coords.latitude * 1e6) / 1e6;
        const lng = Math.round(pos.coords.longitude * 1e6) / 1e6;
        let named: Place | null = null;
        try {
          named = (await apiFetch<{ place: Place | null }>(`/api/places/nearest?lat=${lat}&lng=${lng}`)).place;
        } catch {
          named = null;
        }
        const where = named ? `Where you are (near ${named.label})` : "Where you are now";
        typed.current = false;
        setText(where);
        setStatus(`Chosen: ${where}.`);
        onChange({ lat, lng, label: where });
      },
      () => setStatus("Your position is not available (not allowed, or not found): type a place instead."),
      { timeout: 10_000, maximumAge: 60_000 },
    );
  };

  const describedBy = [hint ? `${inputId}-hint` : null, `${inputId}-status`, error ? `${inputId}-error` : null].filter(Boolean).join(" ");
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={inputId} className="font-medium">
        {label}
      </label>
      {hint ? (
        <p id={`${inputId}-hint`} className="text-sm text-humus-600">
          {hint}
        </p>
      ) : null}
      <div className="relative flex flex-wrap gap-2">
        <input
          ref={ref}
          id={inputId}
          name={name}
          type="text"
          role="combobox"
          autoComplete="off"
          spellCheck={false}
          aria-autocomplete="list"
          aria-expanded={open && places.length > 0}
          aria-controls={listId}
          aria-activedescendant={open && active >= 0 ? `${listId}-${active}` : undefined}
          aria-invalid={error ? true : undefined}
          aria-describedby={describedBy}
          placeholder="A street, village or postcode"
          value={text}
          onChange={(e) => {
            typed.current = true;
            setText(e.target.value);
          }}
          onKeyDown={onKeyDown}
          onBlur={() => setTimeout(() => setOpen(false), 150)}
          className={`min-h-11 min-w-0 flex-1 rounded-lg border bg-white px-3 py-2 ${error ? "border-ember-600" : "border-humus-300"}`}
        />
        {allowHere ? (
          <button type="button" onClick={useHere} className="min-h-11 rounded-lg px-3 py-2 text-sm font-medium ring-1 ring-humus-300 hover:bg-humus-100">
            Use where I am
          </button>
        ) : null}
        <ul
          id={listId}
          role="listbox"
          aria-label={`${label}: places found`}
          hidden={!open || places.length === 0}
          className="absolute left-0 right-0 top-full z-[1000] mt-1 max-h-72 overflow-auto rounded-lg bg-white py-1 shadow-lg ring-1 ring-humus-300"
        >
          {places.map((p, i) => (
            <li
              key={p.id}
              id={`${listId}-${i}`}
              role="option"
              aria-selected={i === active}
              onMouseDown={(e) => e.preventDefault()}
              onClick={() => choose(p)}
              className={`cursor-pointer px-3 py-2 ${i === active ? "bg-moss-100 text-moss-900" : "hover:bg-humus-100"}`}
            >
              <span className="font-medium">{p.name}</span>
              <span className="text-sm text-humus-600">
                {p.context ? `, ${p.context}` : ""} · {KIND_LABEL[p.kind]}
              </span>
            </li>
          ))}
        </ul>
      </div>
      <p id={`${inputId}-status`} aria-live="polite" className="text-sm text-humus-700">
        {status || (value ? `Chosen: ${value.label}.` : "")}
      </p>
      <p id={`${inputId}-error`} aria-live="polite" className="min-h-5 text-sm text-ember-600">
        {error ?? ""}
      </p>
    </div>
  );
});

const KIND_LABEL: Record<Place["kind"], string> = { town: "town", village: "village", postcode: "postcode", street: "street", landmark: "place" };
