import type { Model, ModelInput, Revision } from '../api/api-types';

/** The content of a model as a save body (`ModelInput`): what PUT replaces, with the revision comment. */
export function modelInputOf(model: Model | Revision, comment = ''): ModelInput {
  return {
    name: model.name,
    description: model.description,
    tags: [...model.tags],
    plant: model.plant,
    compensator: model.compensator,
    design: { gain: model.design.gain, targets: model.design.targets },
    comment,
  };
}
