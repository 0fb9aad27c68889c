/**
 * The live preview on the GPU (WebGL2): the photo as a texture of sRGB code values and the look's
 * table as 3-D textures (hardware trilinear interpolation): the grey at each node for the grey view, the
 * stops for the zone map, each a 16-bit code in two 8-bit channels (shared/photo/preview-lut.ts: a
 * software GPU filters 8-bit textures 2–3× faster than half floats); one full-screen pass with one table
 * read per pixel. Measured in a headless browser's software GPU, a grey node table draws in about two
 * thirds of the time of stops followed by a 1-D tone texture, and the zone map is its own program so the
 * grey view does not pay for it.
 * Views: the look's grey, the colour original, or the zone map (our own style: each zone in its step
 * of the grey ramp, contour lines in the accent colour between zones, warning hatching where the tone
 * falls off the scale). A wipe shows the original left of a line (the line itself is drawn by the page).
 */
import type { PreviewLut } from './preview-protocol';

export type PreviewMode = 'look' | 'original' | 'zones';
export interface DrawOptions {
  mode: PreviewMode;
  /** 0..1: the original left of this x, the look right of it; null for no wipe */
  wipe: number | null;
}

const VS = `#version 300 es
in vec2 aPos;
out vec2 vUv;
void main() { vUv = vec2(aPos.x * 0.5 + 0.5, 0.5 - aPos.y * 0.5); gl_Position = vec4(aPos, 0.0, 1.0); }`;

const HEAD = `#version 300 es
precision highp float;
precision highp sampler3D;
uniform sampler2D uPhoto;
uniform sampler3D uLut;
uniform float uLutSize;
uniform float uStopsMin;
uniform float uStopsRange;
uniform float uWipe;
in vec2 vUv;
out vec4 outColour;
/** the table's 16-bit code (0..1) at sRGB-encoded c, from its (high, low) byte channels */
float lut16(vec3 c) {
  vec2 hl = texture(uLut, (c * (uLutSize - 1.0) + 0.5) / uLutSize).rg;
  return (256.0 * hl.r + hl.g) / 257.0;
}
`;

/** Grey (or the original where the wipe or the mode says so). */
const FS_GREY = `${HEAD}
uniform int uOriginal;
void main() {
  vec3 c = texture(uPhoto, vUv).rgb;
  if (uOriginal == 1 || vUv.x < uWipe) { outColour = vec4(c, 1.0); return; }
  outColour = vec4(vec3(lut16(c)), 1.0);
}`;

/** The zone map. */
const FS_ZONES = `${HEAD}
uniform float uOffset;
uniform vec3 uZones[11];
const vec3 ACCENT = vec3(0.114, 0.361, 0.478);
const vec3 WARN = vec3(0.761, 0.255, 0.047);
void main() {
  // zones of a slightly smoothed photo (a coarser mip level), so grain does not fray the contours
  vec3 c = texture(uPhoto, vUv).rgb;
  vec3 m = textureLod(uPhoto, vUv, 1.5).rgb;
  float z = 5.0 + uStopsMin + lut16(m) * uStopsRange + uOffset;
  float w = z - 0.5;
  float edge = abs(w - floor(w + 0.5)) / max(fwidth(w), 1e-4);
  if (vUv.x < uWipe) { outColour = vec4(c, 1.0); return; }
  vec3 col = mix(ACCENT, uZones[int(clamp(floor(z + 0.5), 0.0, 10.0))], smoothstep(0.6, 1.6, edge));
  if (z < -0.5 || z > 10.5) {
    float stripe = mod(gl_FragCoord.x + (z < 0.0 ? gl_FragCoord.y : -gl_FragCoord.y), 14.0);
    if (stripe < 5.0) col = mix(col, WARN, 0.85);
  }
  outColour = vec4(col, 1.0);
}`;

/** The zone ramp's greys (tailwind.config.ts zone.0..10), 0..1 per channel. */
const ZONE_HEX = ['#000000', '#1b1b1b', '#303030', '#474747', '#5e5e5e', '#777777', '#919191', '#ababab', '#c6c6c6', '#e2e2e2', '#ffffff'];

function compile(gl: WebGL2RenderingContext, type: number, src: string): WebGLShader {
  const sh = gl.createShader(type)!;
  gl.shaderSource(sh, src);
  gl.compileShader(sh);
  if (!gl.getShaderParameter(sh, gl.COMPILE_STATUS)) throw new Error(gl.getShaderInfoLog(sh) ?? 'shader');
  return sh;
}

/** Whether this browser gives a WebGL2 context. */
export function webgl2Available(): boolean {
  try {
    return !!document.createElement('canvas').getContext('webgl2');
  } catch {
    return false;
  }
}

interface Program {
  prog: WebGLProgram;
  u: Record<string, WebGLUniformLocation | null>;
}

export class GlPreview {
  private gl: WebGL2RenderingContext;
  private grey: Program;
  private zones: Program;
  private photo: WebGLTexture;
  /** grey codes (the grey view), stops codes (the zone map) */
  private greyTex: WebGLTexture;
  private stopsTex: WebGLTexture;
  /** how the photo is read: 1:1 for the grey, mipmapped for the zone map */
  private exact: WebGLSampler;
  private smooth: WebGLSampler;
  private lut: PreviewLut | null = null;
  private hasPhoto = false;

  constructor(private canvas: HTMLCanvasElement) {
    const gl = canvas.getContext('webgl2', { antialias: false, preserveDrawingBuffer: true, premultipliedAlpha: false });
    if (!gl) throw new Error('WebGL2 is not available');
    this.gl = gl;
    const buf = gl.createBuffer();
    gl.bindBuffer(gl.ARRAY_BUFFER, buf);
    gl.bufferData(gl.ARRAY_BUFFER, new Float32Array([-1, -1, 1, -1, -1, 1, 1, 1]), gl.STATIC_DRAW);
    this.grey = this.program(FS_GREY, ['uOriginal']);
    this.zones = this.program(FS_ZONES, ['uOffset', 'uZones']);
    const zones = new Float32Array(33);
    ZONE_HEX.forEach((h, i) => {
      for (let k = 0; k < 3; k++) zones[i * 3 + k] = parseInt(h.slice(1 + 2 * k, 3 + 2 * k), 16) / 255;
    });
    gl.useProgram(this.zones.prog);
    gl.uniform3fv(this.zones.u.uZones, zones);
    this.photo = gl.createTexture()!;
    this.greyTex = gl.createTexture()!;
    this.stopsTex = gl.createTexture()!;
    this.exact = gl.createSampler()!;
    this.smooth = gl.createSampler()!;
    for (const [sm, min, mag] of [[this.exact, gl.NEAREST, gl.NEAREST], [this.smooth, gl.LINEAR_MIPMAP_LINEAR, gl.LINEAR]] as const) {
      gl.samplerParameteri(sm, gl.TEXTURE_MIN_FILTER, min);
      gl.samplerParameteri(sm, gl.TEXTURE_MAG_FILTER, mag);
      gl.samplerParameteri(sm, gl.TEXTURE_WRAP_S, gl.CLAMP_TO_EDGE);
      gl.samplerParameteri(sm, gl.TEXTURE_WRAP_T, gl.CLAMP_TO_EDGE);
    }
  }

  private program(fs: string, extra: string[]): Program {
    const gl = this.gl;
    const prog = gl.createProgram()!;
    gl.attachShader(prog, compile(gl, gl.VERTEX_SHADER, VS));
    gl.attachShader(prog, compile(gl, gl.FRAGMENT_SHADER, fs));
    gl.linkProgram(prog);
    if (!gl.getProgramParameter(prog, gl.LINK_STATUS)) throw new Error(gl.getProgramInfoLog(prog) ?? 'link');
    gl.useProgram(prog);
    const loc = gl.getAttribLocation(prog, 'aPos');
    gl.enableVertexAttribArray(loc);
    gl.vertexAttribPointer(loc, 2, gl.FLOAT, false, 0, 0);
    const u: Record<string, WebGLUniformLocation | null> = {};
    for (const n of ['uPhoto', 'uLut', 'uLutSize', 'uWipe', 'uStopsMin', 'uStopsRange', ...extra]) u[n] = gl.getUniformLocation(prog, n);
    gl.uniform1i(u.uPhoto, 0);
    gl.uniform1i(u.uLut, 1);
    return { prog, u };
  }

  private texParams(target: number, filter: number) {
    const gl = this.gl;
    gl.texParameteri(target, gl.TEXTURE_MIN_FILTER, filter);
    gl.texParameteri(target, gl.TEXTURE_MAG_FILTER, filter);
    gl.texParameteri(target, gl.TEXTURE_WRAP_S, gl.CLAMP_TO_EDGE);
    gl.texParameteri(target, gl.TEXTURE_WRAP_T, gl.CLAMP_TO_EDGE);
    if (target === gl.TEXTURE_3D) gl.texParameteri(target, gl.TEXTURE_WRAP_R, gl.CLAMP_TO_EDGE);
  }

  /** The photo at the frame's size, `width` px (code values as they are: no colour conversion, no premultiplication; read 1:1). */
  setPhoto(img: ImageBitmap | HTMLImageElement, width: number = this.canvas.width) {
    const gl = this.gl;
    gl.activeTexture(gl.TEXTURE0);
    gl.bindTexture(gl.TEXTURE_2D, this.photo);
    gl.pixelStorei(gl.UNPACK_COLORSPACE_CONVERSION_WEBGL, gl.NONE);
    gl.pixelStorei(gl.UNPACK_PREMULTIPLY_ALPHA_WEBGL, false);
    gl.texImage2D(gl.TEXTURE_2D, 0, gl.RGBA8, gl.RGBA, gl.UNSIGNED_BYTE, img);
    gl.generateMipmap(gl.TEXTURE_2D);
    gl.samplerParameteri(this.exact, gl.TEXTURE_MIN_FILTER, img.width === width ? gl.NEAREST : gl.LINEAR);
    gl.samplerParameteri(this.exact, gl.TEXTURE_MAG_FILTER, img.width === width ? gl.NEAREST : gl.LINEAR);
    this.hasPhoto = true;
  }

  /** The look's table: grey and stops at each node, each as a 3-D texture of 16-bit codes in two bytes. */
  setLut(lut: PreviewLut) {
    const gl = this.gl;
    if (this.lut?.key === lut.key) return;
    gl.pixelStorei(gl.UNPACK_ALIGNMENT, 1);
    for (const [tex, data] of [[this.greyTex, lut.gpu.grey], [this.stopsTex, lut.gpu.stops]] as const) {
      gl.activeTexture(gl.TEXTURE1);
      gl.bindTexture(gl.TEXTURE_3D, tex);
      gl.texImage3D(gl.TEXTURE_3D, 0, gl.RG8, lut.size, lut.size, lut.size, 0, gl.RG, gl.UNSIGNED_BYTE, data);
      this.texParams(gl.TEXTURE_3D, gl.LINEAR);
    }
    this.lut = lut;
  }

  /** Draws at the canvas's size, and waits for the frame (a one-pixel read) so the caller can time it. */
  draw(o: DrawOptions): boolean {
    if (!this.hasPhoto || (!this.lut && o.mode !== 'original')) return false;
    const gl = this.gl;
    const w = this.canvas.width;
    const h = this.canvas.height;
    const p = o.mode === 'zones' ? this.zones : this.grey;
    gl.useProgram(p.prog);
    gl.bindSampler(0, o.mode === 'zones' ? this.smooth : this.exact);
    gl.activeTexture(gl.TEXTURE1);
    gl.bindTexture(gl.TEXTURE_3D, o.mode === 'zones' ? this.stopsTex : this.greyTex);
    gl.viewport(0, 0, w, h);
    gl.uniform1f(p.u.uLutSize, this.lut?.size ?? 2);
    gl.uniform1f(p.u.uWipe, o.wipe ?? -1);
    if (o.mode === 'zones') {
      gl.uniform1f(p.u.uOffset, this.lut?.tone.offsetStops ?? 0);
      gl.uniform1f(p.u.uStopsMin, this.lut?.gpu.stopsMin ?? 0);
      gl.uniform1f(p.u.uStopsRange, this.lut ? this.lut.gpu.stopsMax - this.lut.gpu.stopsMin : 1);
    } else gl.uniform1i(p.u.uOriginal, o.mode === 'original' ? 1 : 0);
    gl.drawArrays(gl.TRIANGLE_STRIP, 0, 4);
    gl.readPixels(0, 0, 1, 1, gl.RGBA, gl.UNSIGNED_BYTE, new Uint8Array(4));
    return true;
  }

  dispose() {
    const gl = this.gl;
    gl.deleteTexture(this.photo);
    gl.deleteTexture(this.greyTex);
    gl.deleteTexture(this.stopsTex);
    gl.deleteProgram(this.grey.prog);
    gl.deleteProgram(this.zones.prog);
    gl.deleteSampler(this.exact);
    gl.deleteSampler(this.smooth);
    gl.getExtension('WEBGL_lose_context')?.loseContext();
  }
}
