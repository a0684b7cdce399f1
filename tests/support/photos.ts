// Test photos as a phone takes them: EXIF with GPS and the camera's serial, and a rotation flag
// (orientation 6: stored landscape, shown portrait), so tests can check what the server strips.
import sharp from 'sharp';

export function phonePhoto(width = 3000, height = 2000): Promise<Buffer> {
  return sharp({ create: { width, height, channels: 3, background: { r: 180, g: 90, b: 40 } } })
    .withMetadata({ orientation: 6 })
    .withExif({
      IFD0: { Make: 'TestCam', Model: 'Phone 1', BodySerialNumber: 'CAM-0042' },
      IFD3: {
        GPSLatitudeRef: 'N',
        GPSLatitude: '42/1 21/1 0/1',
        GPSLongitudeRef: 'W',
        GPSLongitude: '71/1 3/1 0/1',
      },
    })
    .jpeg()
    .toBuffer();
}
