import { reactive, ref, type Ref } from 'vue';
import { useI18n } from 'vue-i18n';
import type { Attachment, EquipmentModel, Fuel, Ticket, Urgency } from '@shared/schemas/tickets';
import { equipmentApi, ticketsApi, type TicketDraft } from '@/api/tickets';
import { useFormErrors } from './useFormErrors';
import { newClientId } from './useTicketChat';

export const TICKET_FIELDS = [
  'subject',
  'modelText',
  'equipmentModelId',
  'serial',
  'fuel',
  'urgency',
  'description',
];

export interface TicketFormValues {
  subject: string;
  /** A catalogue model's id, or the model as the contractor typed it. */
  model: number | string | '';
  serial: string;
  fuel: Fuel | '';
  urgency: Urgency | '';
  description: string;
}

/** The request body for the form's values, or the first missing field's name. */
export function toDraft(values: TicketFormValues): TicketDraft | { missing: 'subject' | 'fuel' | 'urgency' } {
  const subject = values.subject.trim();
  if (!subject) return { missing: 'subject' };
  if (!values.fuel) return { missing: 'fuel' };
  if (!values.urgency) return { missing: 'urgency' };
  const draft: TicketDraft = {
    subject,
    description: values.description.trim(),
    fuel: values.fuel,
    urgency: values.urgency,
  };
  if (typeof values.model === 'number') draft.equipmentModelId = values.model;
  else if (values.model.trim()) draft.modelText = values.model.trim();
  if (values.serial.trim()) draft.serial = values.serial.trim();
  return draft;
}

/** The photos chosen in the form (see usePhotoUpload). */
export interface FormPhotos {
  items: Ref<readonly unknown[]>;
  attachments: Ref<Attachment[]>;
  uploadAll: (ticketId: number) => Promise<boolean>;
}

/** The "new ticket" form: values, catalogue search, errors in place, and submit. */
export function useTicketForm() {
  const { t } = useI18n();
  const values = reactive<TicketFormValues>({
    subject: '',
    model: '',
    serial: '',
    fuel: '',
    urgency: '',
    description: '',
  });
  const errors = useFormErrors(TICKET_FIELDS);
  const submitting = ref(false);
  const models = ref<EquipmentModel[]>([]);
  const searching = ref(false);
  /** Set once the ticket exists: sending again only finishes its photos. */
  const created = ref<Ticket | null>(null);
  let searchController: AbortController | null = null;

  async function searchModels(q: string): Promise<void> {
    searchController?.abort();
    const controller = new AbortController();
    searchController = controller;
    searching.value = true;
    try {
      models.value = (await equipmentApi.search(q.trim(), controller.signal)).items;
    } catch {
      if (!controller.signal.aborted) models.value = [];
    } finally {
      if (searchController === controller) searching.value = false;
    }
  }

  /** Upload the photos and send them as the ticket's first message; false when some did not go. */
  async function sendPhotos(ticket: Ticket, photos: FormPhotos): Promise<boolean> {
    if (photos.items.value.length === 0) return true;
    if (!(await photos.uploadAll(ticket.id))) return false;
    try {
      const attachmentIds = photos.attachments.value.map((a) => a.id);
      await ticketsApi.sendMessage(ticket.id, { body: '', clientId: newClientId(), attachmentIds });
      return true;
    } catch {
      return false;
    }
  }

  /** Create the ticket (once), then send the photos; null when the form has errors. */
  async function submit(photos?: FormPhotos): Promise<{ ticket: Ticket; photosFailed: boolean } | null> {
    errors.clear();
    const draft = toDraft(values);
    if ('missing' in draft) {
      errors.set({ [draft.missing]: t(`tickets.new.${draft.missing}Required`) });
      return null;
    }
    submitting.value = true;
    try {
      created.value ??= (await ticketsApi.create(draft)).ticket;
      const ticket = created.value;
      const photosFailed = photos ? !(await sendPhotos(ticket, photos)) : false;
      return { ticket, photosFailed };
    } catch (error) {
      errors.fromError(error);
      // The model is one control in the form, whichever way the server names it.
      if (errors.fields.equipmentModelId && !errors.fields.modelText) {
        errors.fields.modelText = errors.fields.equipmentModelId;
      }
      return null;
    } finally {
      submitting.value = false;
    }
  }

  return { values, errors, submitting, created, models, searching, searchModels, submit };
}
