// Reads a chosen file in the browser and refuses one too large to send before reading it.
export async function readChosenFile(file: File, maxBytes: number): Promise<string> {
  if (file.size > maxBytes)
    throw new Error(
      `${file.name} is ${(file.size / 1024 / 1024).toFixed(1)} MiB; the desk takes at most ${Math.round(maxBytes / 1024 / 1024)} MiB at a time. Split the file.`,
    );
  return file.text();
}
