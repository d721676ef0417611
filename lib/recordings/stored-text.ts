// Streams a stored raw file into the recording reader: bytes -> UTF-8 text (strict) -> reader.push. A file that is
// not UTF-8 text (an image or a spreadsheet renamed .csv) fails with the line and column of the first bad byte.
import type { Readable } from 'node:stream';
import { createRecordingReader, SignalInputError, type ImportProfile, type RawRecording } from '@/lib/signal';

function notText(line: number, column: number, what: string): SignalInputError {
  return new SignalInputError('not-text', `${what}; expected a CSV text file (UTF-8)`, { line, column });
}

/** Line and column (1-based) of `index` in `text`, counting `linesBefore` complete lines before it. */
function position(text: string, index: number, linesBefore: number): [number, number] {
  const before = text.slice(0, index);
  const newlines = before.split('\n').length - 1;
  const column = index - (before.lastIndexOf('\n') + 1) + 1;
  return [linesBefore + newlines + 1, column];
}

/** `byteSize`, the stored file's size when known, sizes the reader's arrays once (a hint: it changes no result). */
export async function readStoredRecording(source: Readable, profile?: ImportProfile, byteSize?: number): Promise<RawRecording> {
  const reader = createRecordingReader({ profile, bytes: byteSize });
  const decoder = new TextDecoder('utf-8', { fatal: true });
  let linesBefore = 0;
  const take = (text: string) => {
    const nul = text.indexOf('\0');
    if (nul >= 0) {
      const [line, column] = position(text, nul, linesBefore);
      throw notText(line, column, 'the file holds binary data (a NUL byte)');
    }
    reader.push(text);
    for (let i = text.indexOf('\n'); i >= 0; i = text.indexOf('\n', i + 1)) linesBefore++;
  };
  try {
    for await (const chunk of source) {
      const bytes = chunk as Buffer;
      let text: string;
      try {
        text = decoder.decode(bytes, { stream: true });
      } catch {
        const loose = new TextDecoder('utf-8').decode(bytes);
        const [line, column] = position(loose, Math.max(0, loose.indexOf('\uFFFD')), linesBefore);
        throw notText(line, column, 'the file is not text (a byte that is not UTF-8)');
      }
      take(text);
    }
    try {
      take(decoder.decode());
    } catch (error) {
      if (error instanceof SignalInputError) throw error;
      throw notText(linesBefore + 1, 1, 'the file ends inside a UTF-8 character');
    }
  } finally {
    source.destroy();
  }
  return reader.end();
}
