import { ElMessage } from 'element-plus';
import 'element-plus/es/components/message/style/css';

/** Below the top bar, not over its navigation. */
const TOP = 76;

/** A short confirmation that something was saved (announced politely to screen readers). */
export function useNotice() {
  return {
    success: (message: string) =>
      ElMessage({ type: 'success', message, duration: 4000, showClose: true, offset: TOP }),
    error: (message: string) =>
      ElMessage({ type: 'error', message, duration: 6000, showClose: true, offset: TOP }),
  };
}
