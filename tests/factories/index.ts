// The one set of test factories: one per thing, options named after the table's columns.
export * from "./users";
export * from "./listings";
export * from "./reservations";
export * from "./beds";
export * from "./giveaways";
