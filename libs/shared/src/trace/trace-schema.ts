/** The trace contract (forward from a supplier lot, backward from a finished lot): written with the trace routes. */
export {};
