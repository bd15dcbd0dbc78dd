import type { MaterialCode } from "@/lib/calc/facts";

// A small drawing per material for listings without photos: bands in the material's colour
// on the same forest-floor ground as the logo.
const COLOURS: Record<MaterialCode, [string, string]> = {
  cardboard: ["#c0a27f", "#a27f58"],
  leaves: ["#d9962b", "#93600f"],
  straw: ["#f0c36b", "#d9962b"],
  worms: ["#b3401f", "#7a2a13"],
  grass_clippings: ["#6f9b55", "#40642e"],
  coffee_grounds: ["#523c27", "#3b2b1d"],
  wood_chips: ["#a27f58", "#6a4e31"],
  manure: ["#6a4e31", "#3b2b1d"],
  compost: ["#3b2b1d", "#271c13"],
};

export function MaterialArt({ material, className = "" }: { material: MaterialCode; className?: string }) {
  const [a, b] = COLOURS[material] ?? COLOURS.compost;
  return (
    <svg viewBox="0 0 120 90" className={className} aria-hidden="true" preserveAspectRatio="xMidYMid slice">
      <rect width="120" height="90" fill="#f7f3ee" />
      <path d="M0 62c20-8 100-8 120 0v28H0z" fill="#523c27" />
      <path d="M0 50c24-10 96-10 120 0v14c-24-8-96-8-120 0z" fill={b} />
      <path d="M0 38c26-10 94-10 120 0v14c-24-9-96-9-120 0z" fill={a} />
      <circle cx="94" cy="20" r="7" fill="#f0c36b" opacity="0.7" />
    </svg>
  );
}
