/** A File's text in pieces (as the browser reads it, about 64 KiB each), decoded as UTF-8 across piece edges. */
export async function* fileText(file: Blob): AsyncGenerator<string> {
  const reader = file.stream().pipeThrough(new TextDecoderStream()).getReader();
  try {
    for (;;) {
      const { done, value } = await reader.read();
      if (done) return;
      yield value;
    }
  } finally {
    reader.releaseLock();
  }
}

/** LandXML files above this size are streamed in the worker instead of read into the page as text. */
export const STREAM_BYTES = 4 * 1024 * 1024;

/** True for a LandXML file large enough to stream (by name: .xml or .landxml). */
export const streamsInWorker = (file: File) => /\.(xml|landxml)$/i.test(file.name) && file.size > STREAM_BYTES;
