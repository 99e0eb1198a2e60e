// Placeholder until the toolpath benchmark lands.
export async function run(): Promise<void> {
  console.log("toolpath benchmark: not written yet");
}
