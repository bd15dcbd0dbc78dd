// The public face of lib/calc: pure functions, no I/O, safe to import anywhere.
export * from "./facts";
export * from "./units";
export * from "./area";
export * from "./cardboard";
export * from "./layers";
export * from "./mass";
export * from "./water";
export * from "./blend";
export * from "./bed-advice";
export * from "./worms";
export * from "./timeline";
export * from "./diversion";
export * from "./cautions";
export * from "./estimate";
