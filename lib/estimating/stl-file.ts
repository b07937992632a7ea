// Measures an STL file where it is: a browser File (or any Blob) read as a stream through the
// engine's StlParser, so a large file is never held in memory whole. Pure apart from reading.
import { StlParser, type StlAnalysis, type StlUnit } from '@/lib/plating';
import type { StlGeometry } from './calculation-schema';

export type StlProgress = (bytesRead: number, totalBytes: number) => void;

// A file already in memory streams without ever leaving the microtask queue, so the page would
// not repaint its progress bar until the end; hand control back to the event loop this often.
const YIELD_EVERY_MS = 30;
const nextTask = () => new Promise<void>((resolve) => setTimeout(resolve, 0));

export async function analyzeStlBlob(
  file: Blob,
  unit: StlUnit,
  onProgress?: StlProgress,
  isCancelled: () => boolean = () => false,
): Promise<StlAnalysis | null> {
  const parser = new StlParser({ unit });
  const reader = file.stream().getReader();
  let read = 0;
  let lastYield = Date.now();
  try {
    for (;;) {
      const { done, value } = await reader.read();
      if (done) break;
      if (isCancelled()) {
        await reader.cancel();
        return null;
      }
      parser.push(value);
      read += value.length;
      onProgress?.(read, file.size);
      if (Date.now() - lastYield > YIELD_EVERY_MS) {
        await nextTask();
        lastYield = Date.now();
      }
    }
  } finally {
    reader.releaseLock();
  }
  return parser.finish();
}

export function stlGeometryOf(fileName: string, a: StlAnalysis): StlGeometry {
  return {
    kind: 'stl',
    fileName: fileName.slice(-255),
    unit: a.unit,
    triangleCount: a.triangleCount,
    areaDm2: a.areaDm2,
    volumeCm3: a.volumeCm3,
    boundingBoxMm: [a.boundingBoxMm.size[0], a.boundingBoxMm.size[1], a.boundingBoxMm.size[2]],
  };
}
