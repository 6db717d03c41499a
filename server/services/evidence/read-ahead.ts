/**
 * Visits `pageCount` pages in order while the next `depth` pages are being read (each query on its
 * own pooled connection), so the database and the writing overlap. A failure in either stops it,
 * and no read is left running.
 */
export async function eachPageReadAhead<T>(
  pageCount: number,
  read: (page: number) => Promise<T>,
  visit: (data: T) => Promise<void>,
  depth = 2,
): Promise<void> {
  const reading: Array<Promise<T>> = [];
  let requested = 0;
  const requestMore = () => {
    while (requested < pageCount && reading.length <= depth) {
      const page = read(requested);
      page.catch(() => undefined); // awaited below; this only keeps a failure during `visit` from counting as unhandled
      reading.push(page);
      requested += 1;
    }
  };
  try {
    requestMore();
    while (reading.length > 0) {
      const data = await reading.shift()!;
      requestMore();
      await visit(data);
    }
  } finally {
    await Promise.allSettled(reading);
  }
}
