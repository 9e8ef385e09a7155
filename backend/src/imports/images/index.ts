/** Televiewer images in: format sniffing, raster and LAS-array reading, the pyramid, storage. */
export { firstBytes, MEDIA_TYPES, sniffFormat, type ImageFormat } from './formats'
export { IMAGE_LIMITS, INLINE_SAMPLES, refuseFile, TILE_ROWS } from './limits'
export { decodeRaster, probeRaster, type RasterFormat, type RasterProbe } from './raster'
export { arraySamples, readLasImages, type LasImages } from './las-image'
export { planLasArrays, planRaster, type HoleFacts } from './plan'
export { levelCount, nextLevel, pyramidLevels, tileCount } from './pyramid'
export { readFileBytes, writeFileChunks, writePyramid, FILE_CHUNK_BYTES } from './store'
export type { DecodedImage, ImagePlan } from './types'
