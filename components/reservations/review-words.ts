/** A review's 1–5 in words, as the form offers it and the card repeats it. */
export const WORDS = ["", "Poor", "Not great", "All right", "Good", "Excellent"];
