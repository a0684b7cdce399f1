import { defineStore } from 'pinia';
import { ref } from 'vue';
import { getSocket, loadedSocket, type AppSocket } from '@/realtime/socket';

/** Failed connection attempts in a row before the shell says the live connection is down. */
const ATTEMPTS_BEFORE_NOTICE = 2;

/** Whether the live connection to the desk is up (global: the shell shows it). */
export const useConnectionStore = defineStore('connection', () => {
  const connected = ref(false);
  /** True between connect() and disconnect(). */
  const wanted = ref(false);
  /** Wanted but down: dropped after being up, or failing to come up. */
  const lost = ref(false);
  let failures = 0;
  const watched = new WeakSet<AppSocket>();

  function watch(socket: AppSocket): void {
    if (watched.has(socket)) return;
    watched.add(socket);
    socket.on('connect', () => {
      connected.value = true;
      lost.value = false;
      failures = 0;
    });
    socket.on('disconnect', () => {
      connected.value = false;
      lost.value = wanted.value;
    });
    socket.on('connect_error', () => {
      failures += 1;
      if (wanted.value && failures >= ATTEMPTS_BEFORE_NOTICE) lost.value = true;
    });
  }

  async function connect(): Promise<void> {
    wanted.value = true;
    const socket = await getSocket();
    watch(socket);
    // Signed out again while the client was loading.
    if (wanted.value && !socket.connected) socket.connect();
  }

  function disconnect(): void {
    wanted.value = false;
    connected.value = false;
    lost.value = false;
    failures = 0;
    void loadedSocket()?.then((socket) => socket.disconnect());
  }

  return { connected, wanted, lost, connect, disconnect };
});
