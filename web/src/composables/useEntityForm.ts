import { reactive, ref, type Ref, type UnwrapRef } from 'vue';
import { useI18n } from 'vue-i18n';
import type { ZodType } from 'zod';
import type { AdminTexts } from './adminTexts';
import { useConfirm } from './useConfirm';
import { useFormErrors } from './useFormErrors';

/** Saves a new entity (id null) or changes to one, and resolves to it as saved. */
export type SaveEntity<Entity, Create, Update> = (
  id: number | null,
  body: Create | Update,
) => Promise<Entity>;

/** What a form dialog needs of a form composable (this one, or one with rules of its own). */
export interface EntityFormHandle<Entity> {
  busy: Ref<boolean>;
  errors: { alert: Ref<string | null> };
  reset: (entity: Entity | null) => void;
  submit: () => Promise<Entity | null>;
}

interface Options<
  Entity extends { id: number; active: boolean },
  Form extends { active: boolean },
  Create,
  Update,
> {
  /** Where its strings are, for asking before it is switched off. */
  texts: AdminTexts<Entity>;
  fields: readonly (keyof Form & string)[];
  blank: () => Form;
  /** The form filled from an existing entity; by default the entity's own values of `fields`. */
  fromEntity?: (entity: Entity) => Form;
  /** The form as the API's body (before validation). */
  toBody: (form: Form) => Record<string, unknown>;
  createSchema: ZodType<Create>;
  updateSchema: ZodType<Update>;
  save: SaveEntity<Entity, Create, Update>;
}

/** A small new/edit form: fill, validate with the shared schema, PATCH only what changed. */
export function useEntityForm<
  Entity extends { id: number; active: boolean },
  Form extends { active: boolean },
  Create,
  Update,
>(options: Options<Entity, Form, Create, Update>) {
  const { t } = useI18n();
  const confirm = useConfirm();
  const fromEntity =
    options.fromEntity ??
    ((entity: Entity) =>
      Object.fromEntries(
        options.fields.map((field) => [field, (entity as Record<string, unknown>)[field]]),
      ) as unknown as Form);
  const form = reactive(options.blank()) as UnwrapRef<Form> & Form;
  const editing = ref<Entity | null>(null) as { value: Entity | null };
  const errors = useFormErrors(options.fields);
  const busy = ref(false);

  function reset(entity: Entity | null): void {
    editing.value = entity;
    errors.clear();
    Object.assign(form, entity ? fromEntity(entity) : options.blank());
  }

  function changes(entity: Entity): Record<string, unknown> {
    const before = options.toBody(fromEntity(entity));
    const after = options.toBody(form);
    return Object.fromEntries(Object.entries(after).filter(([key, value]) => value !== before[key]));
  }

  function confirmDeactivate(entity: Entity): Promise<boolean> {
    const { key, params } = options.texts;
    return confirm({
      title: t(`${key}.deactivateTitle`),
      message: t(`${key}.deactivateMessage`, params(entity)),
      confirm: t(`${key}.deactivateConfirm`),
    });
  }

  /** Resolves to the saved entity, or null when the form stays open. */
  async function submit(): Promise<Entity | null> {
    if (busy.value) return null;
    const entity = editing.value;
    const raw = entity ? changes(entity) : options.toBody(form);
    if (entity && Object.keys(raw).length === 0) return entity;
    const body = errors.validate(entity ? options.updateSchema : options.createSchema, raw);
    if (!body) return null;
    if (entity?.active && !form.active && !(await confirmDeactivate(entity))) return null;
    busy.value = true;
    try {
      return await options.save(entity?.id ?? null, body);
    } catch (error) {
      errors.fromError(error);
      return null;
    } finally {
      busy.value = false;
    }
  }

  return { form, editing, errors, busy, reset, submit };
}
