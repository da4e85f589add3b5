/**
 * A minimal Socket Mode endpoint on loopback: a WebSocket server (RFC 6455 handshake and
 * unfragmented frames, enough for Slack's Socket Mode client) that says hello, sends envelopes
 * the way Slack does (Slack API docs, "Using Socket Mode") and records the client's acks.
 */
import { createHash } from 'node:crypto';
import { createServer, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import type { Duplex } from 'node:stream';

const GUID = '258EAFA5-E914-47DA-95CA-C5AB0DC85B11';

function frame(opcode: number, payload: Buffer): Buffer {
  const len = payload.length;
  const head = len < 126 ? Buffer.from([0x80 | opcode, len]) : len < 65536 ? Buffer.alloc(4) : Buffer.alloc(10);
  if (len >= 126 && len < 65536) {
    head[0] = 0x80 | opcode;
    head[1] = 126;
    head.writeUInt16BE(len, 2);
  } else if (len >= 65536) {
    head[0] = 0x80 | opcode;
    head[1] = 127;
    head.writeBigUInt64BE(BigInt(len), 2);
  }
  return Buffer.concat([head, payload]);
}

export interface Ack {
  readonly envelope_id: string;
  readonly payload?: Record<string, unknown>;
}

export class FakeSocketMode {
  readonly acks: Ack[] = [];
  private server: Server | undefined;
  private socket: Duplex | undefined;
  private port = 0;

  get url(): string {
    return `ws://127.0.0.1:${this.port}/link`;
  }

  get connected(): boolean {
    return this.socket !== undefined && !this.socket.destroyed;
  }

  async start(): Promise<void> {
    this.server = createServer((_req, res) => res.writeHead(426).end());
    this.server.on('upgrade', (req, socket) => {
      const key = req.headers['sec-websocket-key'];
      const accept = createHash('sha1').update(`${key}${GUID}`).digest('base64');
      socket.write(
        'HTTP/1.1 101 Switching Protocols\r\nUpgrade: websocket\r\nConnection: Upgrade\r\n' + `Sec-WebSocket-Accept: ${accept}\r\n\r\n`,
      );
      this.socket = socket;
      let buffer = Buffer.alloc(0);
      socket.on('data', (chunk: Buffer) => {
        buffer = Buffer.concat([buffer, chunk]);
        for (;;) {
          const parsed = this.parse(buffer);
          if (!parsed) break;
          buffer = buffer.subarray(parsed.used);
          this.onFrame(parsed.opcode, parsed.payload);
        }
      });
      socket.on('error', () => undefined);
      this.sendJson({ type: 'hello', num_connections: 1, debug_info: { host: 'fake-socket', approximate_connection_time: 3600 }, connection_info: { app_id: 'A0SHIFTPROBE' } });
    });
    await new Promise<void>((resolve) => this.server!.listen(0, '127.0.0.1', resolve));
    this.port = (this.server.address() as AddressInfo).port;
  }

  private parse(b: Buffer): { opcode: number; payload: Buffer; used: number } | undefined {
    if (b.length < 2) return undefined;
    const opcode = b[0]! & 0x0f;
    const masked = (b[1]! & 0x80) !== 0;
    let len = b[1]! & 0x7f;
    let at = 2;
    if (len === 126) {
      if (b.length < 4) return undefined;
      len = b.readUInt16BE(2);
      at = 4;
    } else if (len === 127) {
      if (b.length < 10) return undefined;
      len = Number(b.readBigUInt64BE(2));
      at = 10;
    }
    const maskAt = at;
    if (masked) at += 4;
    if (b.length < at + len) return undefined;
    const payload = Buffer.from(b.subarray(at, at + len));
    if (masked) for (let i = 0; i < payload.length; i += 1) payload[i]! ^= b[maskAt + (i % 4)]!;
    return { opcode, payload, used: at + len };
  }

  private onFrame(opcode: number, payload: Buffer): void {
    if (opcode === 0x1) this.acks.push(JSON.parse(payload.toString('utf8')) as Ack);
    else if (opcode === 0x9) this.socket?.write(frame(0xa, payload));
    else if (opcode === 0x8) {
      this.socket?.write(frame(0x8, payload));
      this.socket?.end();
    }
  }

  sendJson(message: Record<string, unknown>): void {
    this.socket?.write(frame(0x1, Buffer.from(JSON.stringify(message), 'utf8')));
  }

  /** An envelope as Slack sends it; resolves with the client's ack. */
  async deliver(envelopeId: string, type: string, payload: Record<string, unknown>, retryAttempt = 0): Promise<Ack> {
    this.sendJson({ envelope_id: envelopeId, type, payload, accepts_response_payload: type !== 'events_api', retry_attempt: retryAttempt, retry_reason: retryAttempt ? 'timeout' : '' });
    const started = Date.now();
    for (;;) {
      const ack = this.acks.find((a) => a.envelope_id === envelopeId && !('seen' in a));
      if (ack) {
        Object.assign(ack, { seen: true });
        return ack;
      }
      if (Date.now() - started > 5000) throw new Error(`no ack for ${envelopeId}`);
      await new Promise((r) => setTimeout(r, 5));
    }
  }

  async stop(): Promise<void> {
    this.socket?.destroy();
    this.server?.closeAllConnections();
    await new Promise<void>((resolve) => (this.server ? this.server.close(() => resolve()) : resolve()));
  }
}
