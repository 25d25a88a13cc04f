/**
 * Where a device publishes, said beside its credential so that nobody has to ask: the external
 * broker's URL when the server uses one (its user name and password removed — those are the
 * server's own, not the device's), else the embedded broker's port on the host the request came to.
 */
export type BrokerAddress = { externalUrl: string } | { port: number } | null;

/**
 * @param address the broker the server runs or uses (null before it has started, e.g. in a bare app)
 * @param requestHost the host name the browser used to reach this server (no port)
 * @returns e.g. `{ url: "mqtt://plant-server:1883" }`, or null when not known
 */
export function brokerForDevices(address: BrokerAddress, requestHost: string): { url: string } | null {
  if (!address) return null;
  if ('externalUrl' in address) {
    const url = new URL(address.externalUrl);
    url.username = '';
    url.password = '';
    return { url: url.toString().replace(/\/$/, '') };
  }
  const host = requestHost.includes(':') && !requestHost.startsWith('[') ? `[${requestHost}]` : requestHost;
  return { url: `mqtt://${host}:${address.port}` };
}
