// Hands a made file to the browser as a download (an object URL clicked, released after a while).
export function downloadFile(file: { name: string; blob: Blob }): void {
  const url = URL.createObjectURL(file.blob);
  const a = document.createElement('a');
  a.href = url;
  a.download = file.name;
  a.click();
  // Released later, not at once: some browsers read the URL after click() returns.
  setTimeout(() => URL.revokeObjectURL(url), 10_000);
}
