// compare layer barrel: one export per line.
export {};
