import { Router } from "express";
import { fieldErrors } from "../../knowledge/contracts/layers";
import { evaporationRequestSchema, planSourceRefs, type EvaporationResponse } from "../../knowledge/contracts/plans";
import { evaporationSettings, vapourPressureMbar } from "../../knowledge/plan";
import { requireSolvent } from "../../knowledge/reference";
import type { AppDeps } from "../deps";
import { badRequest, HttpError } from "../middleware/errors";
import { referenceFor } from "../reference-data";

/** Public: rotary-evaporator pressure or boiling point for one solvent (Antoine equation, 20-degree rule). */
export function evaporationRouter(deps: AppDeps): Router {
  const router = Router();
  router.post("/evaporation", async (req, res) => {
    const parsed = evaporationRequestSchema.safeParse(req.body);
    if (!parsed.success) throw badRequest("Some fields need attention.", fieldErrors(parsed.error));
    const body = parsed.data;
    const ref = await referenceFor(req, deps);
    const solvent = requireSolvent(body.solvent, "solvent", ref);
    const antoine = solvent.antoine?.value;
    if (!antoine) {
      throw new HttpError(
        400,
        "no_vapour_data",
        `The solvent table has no Antoine constants for ${solvent.name}, so its vapour pressure is not computed here; take the pressure from its SDS or a handbook.`,
        { solvent: `No Antoine constants for ${solvent.name}.` },
      );
    }
    const range = {
      minC: antoine.minC,
      maxC: antoine.maxC,
      minMbar: vapourPressureMbar(solvent, antoine.minC),
      maxMbar: vapourPressureMbar(solvent, antoine.maxC),
    };
    const field = body.vaporTemperatureC !== undefined ? "vaporTemperatureC" : "pressureMbar";
    const outside =
      body.vaporTemperatureC !== undefined
        ? body.vaporTemperatureC < range.minC || body.vaporTemperatureC > range.maxC
        : body.pressureMbar! < range.minMbar || body.pressureMbar! > range.maxMbar;
    if (outside) {
      const message = `The Antoine constants for ${solvent.name} hold from ${range.minC} to ${range.maxC} °C (${range.minMbar.toFixed(1)}–${range.maxMbar.toFixed(0)} mbar); ${
        field === "vaporTemperatureC" ? `${body.vaporTemperatureC} °C` : `${body.pressureMbar} mbar`
      } is outside, and extrapolating the equation is not reliable.`;
      throw new HttpError(400, "outside_antoine_range", message, { [field]: message }, { range });
    }
    const settings = evaporationSettings(
      body.vaporTemperatureC !== undefined
        ? { solvent: solvent.key, vaporTemperatureC: body.vaporTemperatureC }
        : { solvent: solvent.key, pressureMbar: body.pressureMbar! },
      ref,
    );
    const out: EvaporationResponse = { ...settings, sourceTitles: planSourceRefs(settings.sources) };
    res.json(out);
  });
  return router;
}
