import { onBeforeUnmount, onMounted, ref } from 'vue';
import type { PresenceEntry } from '@shared/events';
import { getSocket, type AppSocket } from '@/realtime/socket';
import { mergePresence } from './presenceMerge';

const ASK_TIMEOUT_MS = 8000;

/**
 * Who is on my branch desks right now: the list is asked for once (and again after every
 * reconnect), then kept current from 'presence:changed'.
 */
export function useDeskPresence() {
  const online = ref<PresenceEntry[]>([]);
  const loading = ref(true);
  const error = ref<string | null>(null);
  let socket: AppSocket | null = null;
  let stopped = false;

  function ask(): void {
    if (!socket?.connected) return;
    socket.timeout(ASK_TIMEOUT_MS).emit('presence:list', (err, res) => {
      loading.value = false;
      if (err) error.value = err.message;
      else if (!res.ok) error.value = res.error.message;
      else {
        error.value = null;
        online.value = res.online;
      }
    });
  }

  const onChanged = ({ entry, online: isOnline }: { entry: PresenceEntry; online: boolean }) => {
    online.value = mergePresence(online.value, entry, isOnline);
  };

  onMounted(async () => {
    const s = await getSocket();
    if (stopped) return;
    socket = s;
    s.on('presence:changed', onChanged);
    s.on('connect', ask);
    ask();
  });

  onBeforeUnmount(() => {
    stopped = true;
    socket?.off('presence:changed', onChanged);
    socket?.off('connect', ask);
  });

  return {
    online,
    loading,
    error,
    retry: () => {
      loading.value = true;
      error.value = null;
      ask();
    },
  };
}
