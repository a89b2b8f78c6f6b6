import sharp from 'sharp';

/**
 * "Photos" of our own making for the demo fitting and the tests: a calico toile of the corset bodice
 * pinned on a dress form, drawn as SVG and rendered by sharp. No person, no camera: a drawing.
 * `view` turns the form (front, three-quarter, back); `marks` draws the fitter's chalk marks.
 */
export type ToileView = 'front' | 'three-quarter' | 'back';

export function toilePhotoSvg(view: ToileView, widthPx = 1200, heightPx = 1600, marks = true): string {
	const squeeze = view === 'three-quarter' ? 0.82 : 1;
	const cx = 600;
	const x = (dx: number) => (cx + dx * squeeze).toFixed(1);
	const seams = view === 'back' ? [-150, -60, 60, 150] : [-170, -90, 0, 90, 170];
	const chalk = marks
		? `<g stroke="#2f5d9a" stroke-width="6" fill="none" stroke-linecap="round">
			<path d="M ${x(205)} 860 q 18 40 0 80"/><path d="M ${x(185)} 900 h 40"/>
			<path d="M ${x(-200)} 980 h ${(400 * squeeze).toFixed(1)}" stroke-dasharray="18 12"/>
		</g>`
		: '';
	return `<svg xmlns="http://www.w3.org/2000/svg" width="${widthPx}" height="${heightPx}" viewBox="0 0 1200 1600">
	<defs>
		<linearGradient id="wall" x1="0" y1="0" x2="0" y2="1"><stop offset="0" stop-color="#ece6da"/><stop offset="1" stop-color="#d9d0bf"/></linearGradient>
		<linearGradient id="calico" x1="0" y1="0" x2="1" y2="0"><stop offset="0" stop-color="#d8ccb2"/><stop offset="0.5" stop-color="#f3ead6"/><stop offset="1" stop-color="#cfc2a6"/></linearGradient>
	</defs>
	<rect width="1200" height="1600" fill="url(#wall)"/>
	<rect y="1380" width="1200" height="220" fill="#b9a88a"/>
	<!-- stand and neck of the dress form -->
	<rect x="585" y="1180" width="30" height="260" fill="#3b3b3b"/>
	<ellipse cx="600" cy="1450" rx="170" ry="26" fill="#2e2e2e"/>
	<path d="M ${x(-50)} 250 Q 600 200 ${x(50)} 250 L ${x(45)} 330 L ${x(-45)} 330 Z" fill="#5a4a3a"/>
	<!-- the form's body (linen-covered) -->
	<path d="M ${x(-230)} 380 Q 600 300 ${x(230)} 380 Q ${x(270)} 600 ${x(215)} 860 Q ${x(250)} 1050 ${x(230)} 1190 L ${x(-230)} 1190 Q ${x(-250)} 1050 ${x(-215)} 860 Q ${x(-270)} 600 ${x(-230)} 380 Z" fill="#6d5c49"/>
	<!-- the toile: bodice to the underbust, midriff band below -->
	<path d="M ${x(-215)} 520 Q 600 470 ${x(215)} 520 L ${x(210)} 860 L ${x(-210)} 860 Z" fill="url(#calico)" stroke="#9c8c6e" stroke-width="3"/>
	<path d="M ${x(-210)} 860 L ${x(210)} 860 L ${x(225)} 1050 L ${x(-225)} 1050 Z" fill="url(#calico)" stroke="#9c8c6e" stroke-width="3"/>
	<g stroke="#8a7a5c" stroke-width="3" fill="none">
		${seams.map((s) => `<path d="M ${x(s)} ${view === 'back' ? 500 : 480} Q ${x(s * 0.92)} 700 ${x(s * 1.02)} 1050"/>`).join('\n\t\t')}
		<path d="M ${x(-210)} 860 Q 600 ${view === 'back' ? 875 : 845} ${x(210)} 860" stroke-width="5"/>
	</g>
	<!-- pins along the underbust seam -->
	<g fill="#b23a3a">${[-180, -120, -60, 0, 60, 120, 180].map((p) => `<circle cx="${x(p)}" cy="${view === 'back' ? 866 : 852}" r="7"/>`).join('')}</g>
	${chalk}
</svg>`;
}

/** The drawing rendered as a JPEG (what a phone would upload), optionally smaller. */
export async function toilePhotoJpeg(view: ToileView, widthPx = 1200, heightPx = 1600): Promise<Buffer> {
	return sharp(Buffer.from(toilePhotoSvg(view, widthPx, heightPx))).jpeg({ quality: 85 }).toBuffer();
}
