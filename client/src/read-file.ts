/**
 * Read a dropped or chosen file as UTF-8 text chunk by chunk (`file.stream()`), so the page can
 * say how many bytes are read and stays responsive: each chunk is decoded between browser tasks,
 * never the whole file in one call. Counts line breaks on the way (for "about n rows").
 */
export interface FileText {
  readonly text: string;
  /** Line breaks seen ('\n'), plus one when the text does not end with one: about the row count. */
  readonly lines: number;
}

export async function readFileText(
  file: File,
  onProgress: (loaded: number, total: number) => void,
  cancelled: () => boolean,
): Promise<FileText | null> {
  // TextDecoder strips a leading byte-order mark, as file.text() does.
  const decoder = new TextDecoder('utf-8');
  const parts: string[] = [];
  const reader = file.stream().getReader();
  let loaded = 0;
  let lines = 0;
  let last = '';
  try {
    for (;;) {
      const { done, value } = await reader.read();
      if (cancelled()) {
        await reader.cancel().catch(() => undefined);
        return null;
      }
      if (done) break;
      loaded += value.byteLength;
      for (let i = value.indexOf(10); i >= 0; i = value.indexOf(10, i + 1)) lines++;
      const part = decoder.decode(value, { stream: true });
      if (part !== '') {
        parts.push(part);
        last = part;
      }
      onProgress(loaded, file.size);
    }
  } finally {
    reader.releaseLock();
  }
  const tail = decoder.decode();
  if (tail !== '') {
    parts.push(tail);
    last = tail;
  }
  if (last !== '' && !last.endsWith('\n')) lines++;
  return { text: parts.join(''), lines };
}
