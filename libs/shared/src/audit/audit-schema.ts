/** The audit log contract (`GET /api/audit-events`): written with the audit routes. */
export {};
