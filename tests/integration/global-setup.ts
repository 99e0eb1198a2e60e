// Filled in by the foundation: a fresh DATA_DIR and migrated SQLite per run.
export default async function setup() {}
