/** Saves `href` (a data: or blob: URL) as a file named `fileName`, through a temporary download link; browser only. */
export function downloadUrl(href: string, fileName: string): void {
  const link = document.createElement("a");
  link.href = href;
  link.download = fileName;
  document.body.appendChild(link);
  link.click();
  link.remove();
}

/** Saves text as a file through a temporary object URL; browser only. */
export function downloadText(text: string, fileName: string, type: string): void {
  const url = URL.createObjectURL(new Blob([text], { type }));
  downloadUrl(url, fileName);
  URL.revokeObjectURL(url);
}
