// Placeholder until the geometry benchmark lands.
export async function run(): Promise<void> {
  console.log("geometry benchmark: not written yet");
}
