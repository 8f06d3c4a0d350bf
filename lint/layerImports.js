import path from 'node:path';

/**
 * The client's layers, checked on the resolved path of each relative import (a pattern on the
 * import text cannot tell `../desk` in a feature from `../local` in a feature's api/ folder):
 * a feature imports no other feature (the app's route table in src/app assembles them), and the
 * shared layers below the features import none.
 */
const SHARED_LAYERS = ['api', 'local', 'ui', 'account', 'core', 'contract'];

/** 'src/features/<name>' of a path inside the project, or undefined. */
function featureOf(relativePath) {
  const match = /^src\/features\/([^/]+)\//.exec(relativePath);
  return match?.[1];
}

function layerOf(relativePath) {
  const match = /^src\/([^/]+)\//.exec(relativePath);
  return match?.[1];
}

/** @type {import('eslint').Rule.RuleModule} */
const layerImports = {
  meta: {
    type: 'problem',
    docs: {
      description: 'A feature imports no other feature; api, local, ui and account import no feature.',
    },
    messages: {
      otherFeature:
        "The '{{from}}' feature imports the '{{to}}' feature: move what both use to src/ui, src/account, src/api or src/local.",
      sharedImportsFeature:
        "src/{{from}} imports the '{{to}}' feature: shared layers import no feature; move the code it needs out of the feature.",
    },
    schema: [],
  },
  create(context) {
    const cwd = context.cwd;
    const file = path.relative(cwd, context.filename).split(path.sep).join('/');
    const ownFeature = featureOf(file);
    const ownLayer = layerOf(file);
    if (!ownFeature && !SHARED_LAYERS.includes(ownLayer)) return {};

    function check(node) {
      const spec = node?.type === 'Literal' && typeof node.value === 'string' ? node.value : undefined;
      if (!spec || !spec.startsWith('.')) return;
      const target = path
        .relative(cwd, path.resolve(path.dirname(context.filename), spec))
        .split(path.sep)
        .join('/');
      const targetFeature = featureOf(`${target}/`);
      if (!targetFeature || targetFeature === ownFeature) return;
      if (ownFeature)
        context.report({ node, messageId: 'otherFeature', data: { from: ownFeature, to: targetFeature } });
      else
        context.report({
          node,
          messageId: 'sharedImportsFeature',
          data: { from: ownLayer, to: targetFeature },
        });
    }

    return {
      ImportDeclaration: (node) => check(node.source),
      ExportNamedDeclaration: (node) => check(node.source),
      ExportAllDeclaration: (node) => check(node.source),
      ImportExpression: (node) => check(node.source),
    };
  },
};

export const layersPlugin = { rules: { 'layer-imports': layerImports } };
