// Makes the test photo of our own with GPS tags (fixtures/photos/toile-with-gps.jpg): the drawn toile
// of src/lib/server/seed/toile-photo.ts, rotated by its EXIF orientation (6: turn 90° clockwise to view)
// and carrying made-up GPS coordinates, so the tests can check that an upload keeps the orientation
// and drops the GPS.   npx tsx scripts/fixture-photos.ts
import { writeFileSync } from 'node:fs';
import sharp from 'sharp';
import { toilePhotoSvg } from '../src/lib/server/seed/toile-photo';

const upright = await sharp(Buffer.from(toilePhotoSvg('front', 600, 800))).png().toBuffer();
// stored lying on its side (800 × 600), as a phone held sideways would; orientation 6 turns it upright
const jpeg = await sharp(upright)
	.rotate(-90)
	.jpeg({ quality: 80 })
	.withExif({
		IFD0: { Make: 'Dartelier fixture', Software: 'scripts/fixture-photos.ts' },
		IFD3: { GPSLatitudeRef: 'N', GPSLatitude: '51/1 30/1 0/1', GPSLongitudeRef: 'W', GPSLongitude: '0/1 7/1 30/1' }
	})
	.withMetadata({ orientation: 6 })
	.toBuffer();
writeFileSync('fixtures/photos/toile-with-gps.jpg', jpeg);
console.log(`fixtures/photos/toile-with-gps.jpg: ${jpeg.length} bytes`);
