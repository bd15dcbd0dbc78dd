import type { Need } from "@/lib/match/types";
export async function runHttpBench(_file: string, _needs: Need[]): Promise<void> {}
