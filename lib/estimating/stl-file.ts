// Measures an STL file where it is: a browser File (or any Blob) read as a stream through the
// engine's StlParser, so a large file is never held in memory whole. Pure apart from reading.
import { StlParser, type StlAnalysis, type StlUnit } from '@/lib/plating';
import type { StlGeometry } from './calculation-schema';

export type StlProgress = (bytesRead: number, totalBytes: number) => void;

export async function analyzeStlBlob(
  file: Blob,
  unit: StlUnit,
  onProgress?: StlProgress,
  isCancelled: () => boolean = () => false,
): Promise<StlAnalysis | null> {
  const parser = new StlParser({ unit });
  const reader = file.stream().getReader();
  let read = 0;
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
