import { ElMessageBox } from 'element-plus';
import 'element-plus/es/components/message-box/style/css';
import { useI18n } from 'vue-i18n';

/** Ask before something that cannot be quietly undone; resolves true when confirmed. */
export function useConfirm() {
  const { t } = useI18n();
  return async (options: { title: string; message: string; confirm: string }): Promise<boolean> => {
    try {
      await ElMessageBox.confirm(options.message, options.title, {
        type: 'warning',
        confirmButtonText: options.confirm,
        cancelButtonText: t('common.cancel'),
        confirmButtonClass: 'el-button--danger',
        autofocus: false,
        closeOnClickModal: false,
      });
      return true;
    } catch {
      return false;
    }
  };
}
