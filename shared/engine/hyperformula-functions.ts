import { CellError, ErrorType, FunctionArgumentType, FunctionPlugin, HyperFormula, type ImplementedFunctions } from 'hyperformula';
import { sheetFunctions } from '@/shared/engine/functions';

/**
 * The sheet functions of our own (those with a `source`) as a HyperFormula plugin, so that the live workbook
 * computes them with the very implementation the compiled evaluator calls. A result that is not a finite
 * number becomes HyperFormula's #NUM!, which the engine reads as the row's error.
 */
class OwnFunctionsPlugin extends FunctionPlugin {
  static override implementedFunctions: ImplementedFunctions = {};

  callOwn(
    name: string,
    ast: { args: Parameters<OwnFunctionsPlugin['runFunction']>[0] },
    state: Parameters<OwnFunctionsPlugin['runFunction']>[1],
  ) {
    const evaluate = sheetFunctions[name]?.evaluate ?? (() => Number.NaN);
    return this.runFunction(ast.args, state, this.metadata(name), (...args: number[]) => {
      const value = evaluate(...args);
      return Number.isFinite(value) ? value : new CellError(ErrorType.NUM);
    });
  }
}

let registered = false;

/** Registers the plugin once per JavaScript realm, before the first workbook is built. */
export function registerOwnFunctions(): void {
  if (registered) return;
  registered = true;
  const translations: Record<string, string> = {};
  for (const [name, definition] of Object.entries(sheetFunctions)) {
    if (definition.source === undefined) continue;
    const method = `own_${name}`;
    OwnFunctionsPlugin.implementedFunctions[name] = {
      method,
      parameters: Array.from({ length: definition.maxArgs }, () => ({ argumentType: FunctionArgumentType.NUMBER })),
    };
    Object.defineProperty(OwnFunctionsPlugin.prototype, method, {
      value(this: OwnFunctionsPlugin, ...call: Parameters<OwnFunctionsPlugin['callOwn']> extends [string, ...infer Rest] ? Rest : never) {
        return this.callOwn(name, ...call);
      },
    });
    translations[name] = name;
  }
  HyperFormula.registerFunctionPlugin(OwnFunctionsPlugin, { enGB: translations, enUS: translations });
}
