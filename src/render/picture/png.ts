/**
 * SVG → PNG with resvg (@resvg/resvg-js: a maintained Rust rasteriser whose binaries ship inside
 * the npm package, no download at install). Only the font packed with the project is loaded
 * (dejavu-fonts-ttf), never the system's, so text always renders and the same picture gives the
 * same bytes on every machine. Callers load this module only when a reply has a picture.
 */
import { createRequire } from 'node:module';
import { Resvg } from '@resvg/resvg-js';
import type { ReplyOk, ReplyPicture } from '../../reply/reply.js';
import { FONT_FAMILY } from './svg.js';
import { trendSvg } from './trend.js';
import { waferMapSvg } from './wafer-map.js';

const require = createRequire(import.meta.url);
let fontFiles: string[] | undefined;
function fonts(): string[] {
  fontFiles ??= [require.resolve('dejavu-fonts-ttf/ttf/DejaVuSans.ttf'), require.resolve('dejavu-fonts-ttf/ttf/DejaVuSans-Bold.ttf')];
  return fontFiles;
}


/** The picture's SVG (our code). */
export function pictureSvg(picture: ReplyPicture): string {
  return picture.kind === 'waferMap' ? waferMapSvg(picture) : trendSvg(picture);
}

/** PNG bytes of an SVG document, at its own size. */
export function rasterise(svg: string): Uint8Array {
  const r = new Resvg(svg, {
    font: { loadSystemFonts: false, fontFiles: fonts(), defaultFontFamily: FONT_FAMILY, sansSerifFamily: FONT_FAMILY },
    fitTo: { mode: 'original' },
    // Anti-aliased shapes: optimizeSpeed (0) renders about 25 ms faster but jagged on a phone.
    shapeRendering: 2,
    textRendering: 1,
  });
  return r.render().asPng();
}

/** The PNG of a reply's picture, or undefined when it has none. */
export function replyPng(reply: ReplyOk): Uint8Array | undefined {
  return reply.picture ? rasterise(pictureSvg(reply.picture)) : undefined;
}

/** A file name for the picture: 'wafer-map-r-1a2b3c.png'. */
export function pictureFileName(reply: ReplyOk): string {
  return `${reply.picture?.kind === 'trend' ? 'trend' : 'wafer-map'}-${reply.id}.png`;
}
