import { reactive, ref, type UnwrapRef } from 'vue';
import type { ZodType } from 'zod';
import { useConfirm } from './useConfirm';
import { useFormErrors } from './useFormErrors';

interface Options<
  Entity extends { id: number; active: boolean },
  Form extends { active: boolean },
  Create,
  Update,
> {
  fields: readonly (keyof Form & string)[];
  blank: () => Form;
  /** The form filled from an existing entity. */
  fromEntity: (entity: Entity) => Form;
  /** The form as the API's body (before validation). */
  toBody: (form: Form) => Record<string, unknown>;
  createSchema: ZodType<Create>;
  updateSchema: ZodType<Update>;
  save: (id: number | null, body: Create | Update) => Promise<Entity>;
  /** Asked before an entity is switched off. */
  confirmDeactivate: (entity: Entity) => { title: string; message: string; confirm: string };
}

/** A small new/edit form: fill, validate with the shared schema, PATCH only what changed. */
export function useEntityForm<
  Entity extends { id: number; active: boolean },
  Form extends { active: boolean },
  Create,
  Update,
>(options: Options<Entity, Form, Create, Update>) {
  const confirm = useConfirm();
  const form = reactive(options.blank()) as UnwrapRef<Form> & Form;
  const editing = ref<Entity | null>(null) as { value: Entity | null };
  const errors = useFormErrors(options.fields);
  const busy = ref(false);

  function reset(entity: Entity | null): void {
    editing.value = entity;
    errors.clear();
    Object.assign(form, entity ? options.fromEntity(entity) : options.blank());
  }

  function changes(entity: Entity): Record<string, unknown> {
    const before = options.toBody(options.fromEntity(entity));
    const after = options.toBody(form);
    return Object.fromEntries(Object.entries(after).filter(([key, value]) => value !== before[key]));
  }

  /** Resolves to the saved entity, or null when the form stays open. */
  async function submit(): Promise<Entity | null> {
    if (busy.value) return null;
    const entity = editing.value;
    const raw = entity ? changes(entity) : options.toBody(form);
    if (entity && Object.keys(raw).length === 0) return entity;
    const body = errors.validate(entity ? options.updateSchema : options.createSchema, raw);
    if (!body) return null;
    if (entity?.active && !form.active && !(await confirm(options.confirmDeactivate(entity)))) return null;
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
