"""The fit's request, its answer and its save body, without HTTP.

The request is the one POST /api/compute/fit takes (lib/fit/schema.ts on the server): params, free
[{key, min?, max?}], priors [{key, mean, sigma}], points or sets [{name, points, calibration}],
scaleByChi2, starts, seed, takeModelSign. The answer is the fit report as the fit command line
prints it (lib/fit/output.ts). The save body is what POST /api/parameter-sets/{id}/fits accepts
(lib/contracts/fits.ts), built as the browser builds it (lib/fit/provenance.ts saveFitBody).
"""

import json
import math
import re
import subprocess
import tempfile
from datetime import datetime, timezone
from pathlib import Path
from typing import Any, Dict, Iterable, List, Mapping, Optional, Sequence, Tuple, Union

from .errors import GyroluxError

JSON = Dict[str, Any]

# The server's default free parameters (lib/analysis/definition.ts DEFAULT_FREE_KEYS): the two
# amplitudes and the electric part's dispersion.
DEFAULT_FREE = ("gyrationPerT", "oscillatorWavelengthNm", "magneticScale")

# POST /api/compute/fit fits up to this many points (lib/contracts/compute.ts SYNC_FIT_POINT_LIMIT);
# the server is the authority and answers 413 above it, this is for messages and documentation.
SYNC_FIT_POINT_LIMIT = 500

# The fields of a measured point the fit takes (lib/measurements/point.ts measuredPointSchema, a
# strict schema: a stored point's ordinal, mask and note must not be sent).
_CONDITIONS = ("temperatureK", "fieldT", "lengthM")

# The calibration of a set (lib/analysis/definition.ts calibrationSchema), with Python spellings.
_CALIBRATION_KEYS = {
    "scaleSigma": "scaleSigma",
    "scale_sigma": "scaleSigma",
    "temperatureSigmaK": "temperatureSigmaK",
    "temperature_sigma_k": "temperatureSigmaK",
    "relativeFloor": "relativeFloor",
    "relative_floor": "relativeFloor",
}

# The name of a set's field × length scale factor among the fitted values (lib/fit/problem.ts scaleName).
_SCALE_NAME = re.compile(r"^fieldLengthScale\[(.*)\]$", re.S)

PriorsArg = Union[Mapping[str, Any], Sequence[Any], None]


def fit_point(point: Mapping[str, Any], params: Mapping[str, Any], line: int) -> JSON:
    """One point in the request's shape: a point from points() keeps its file line; a condition it
    lacks takes the parameters' value (as the command line does for a missing column)."""
    out: JSON = {
        "line": int(point.get("line") or line),
        "wavelengthNm": float(point["wavelengthNm"]),
        "quantity": point.get("quantity") or "verdet",
        "value": float(point["value"]),
        "sigma": float(point["sigma"]),
    }
    for key in _CONDITIONS:
        source = point if point.get(key) is not None else params
        if source.get(key) is None:
            raise ValueError(f"point on line {out['line']}: no {key}, and the parameters have none either")
        out[key] = float(source[key])
    if isinstance(point.get("extra"), Mapping) and point["extra"]:
        out["extra"] = {str(k): str(v) for k, v in point["extra"].items()}
    return out


def fit_points(points: Iterable[Mapping[str, Any]], params: Mapping[str, Any]) -> List[JSON]:
    """The points in the request's shape; one without a line number is numbered as if read from a file with a header."""
    return [fit_point(p, params, i + 2) for i, p in enumerate(points)]


def free_list(free: Optional[Iterable[Union[str, Mapping[str, Any]]]]) -> List[JSON]:
    """["key", …] or [{"key", "min"?, "max"?}, …] as the request's [{key, min?, max?}]."""
    out: List[JSON] = []
    for item in DEFAULT_FREE if free is None else free:
        if isinstance(item, str):
            out.append({"key": item})
            continue
        entry: JSON = {"key": item["key"]}
        for bound in ("min", "max"):
            if item.get(bound) is not None:
                entry[bound] = float(item[bound])
        out.append(entry)
    return out


def prior_list(priors: PriorsArg) -> List[JSON]:
    """{key: (mean, sigma)}, {key: {"mean", "sigma"}}, [(key, mean, sigma)] or [{key, mean, sigma}] as [{key, mean, sigma}]."""
    if not priors:
        return []
    if isinstance(priors, Mapping):
        items: List[Tuple[str, Any]] = list(priors.items())
        return [_prior(key, value) for key, value in items]
    out: List[JSON] = []
    for item in priors:
        if isinstance(item, Mapping):
            out.append({"key": item["key"], "mean": float(item["mean"]), "sigma": float(item["sigma"])})
        else:
            key, mean, sigma = item
            out.append({"key": key, "mean": float(mean), "sigma": float(sigma)})
    return out


def _prior(key: str, value: Any) -> JSON:
    if isinstance(value, Mapping):
        return {"key": key, "mean": float(value["mean"]), "sigma": float(value["sigma"])}
    mean, sigma = value
    return {"key": key, "mean": float(mean), "sigma": float(sigma)}


def calibration_of(calibration: Optional[Mapping[str, Any]]) -> JSON:
    """A set's calibration with every field (0 where not given); unknown names are refused."""
    out = {"scaleSigma": 0.0, "temperatureSigmaK": 0.0, "relativeFloor": 0.0}
    for name, value in (calibration or {}).items():
        if name not in _CALIBRATION_KEYS:
            raise ValueError(f'calibration: "{name}" is not one of scaleSigma, temperatureSigmaK, relativeFloor')
        out[_CALIBRATION_KEYS[name]] = float(value)
    return out


def fit_request(params: Mapping[str, Any], points: Optional[Iterable[Mapping[str, Any]]] = None, *,
                free: Optional[Iterable[Union[str, Mapping[str, Any]]]] = None, priors: PriorsArg = None,
                sets: Optional[Sequence[Mapping[str, Any]]] = None, calibration: Optional[Mapping[str, Any]] = None,
                starts: int = 4, seed: int = 1, magnitudes: bool = False, scale_by_chi2: bool = False) -> JSON:
    """The body of POST /api/compute/fit. Either points (one set, with calibration) or sets, each
    {"name", "points", "calibration"?, "id"?} (the id is kept out of the body; save_fit uses it)."""
    if (points is None) == (sets is None):
        raise ValueError("give either points (one measurement set) or sets (several), not both or neither")
    model = {k: v for k, v in params.items() if k != "wavelengthsNm"}
    body: JSON = {"params": model, "free": free_list(free), "priors": prior_list(priors)}
    if sets is None:
        body["points"] = fit_points(points or [], model)
        body["calibration"] = calibration_of(calibration)
    else:
        if calibration is not None:
            raise ValueError("with sets, give each set its own calibration")
        body["sets"] = [
            {"name": s["name"], "points": fit_points(s["points"], model), "calibration": calibration_of(s.get("calibration"))}
            for s in sets
        ]
    body.update({"scaleByChi2": bool(scale_by_chi2), "starts": int(starts), "seed": int(seed), "takeModelSign": bool(magnitudes)})
    return body


def request_conditions(body: JSON, sets: Optional[Sequence[Mapping[str, Any]]] = None) -> JSON:
    """The request without its points: what save_fit needs to carry the fit's conditions."""
    listed = body.get("sets") or [{"name": "data", "points": body["points"], "calibration": body["calibration"]}]
    ids = [s.get("id") for s in sets] if sets is not None else [None] * len(listed)
    return {
        "free": body["free"],
        "priors": body["priors"],
        "sets": [
            {"name": s["name"], "pointCount": len(s["points"]), "calibration": s["calibration"], **({"id": i} if i else {})}
            for s, i in zip(listed, ids)
        ],
        "scaleByChi2": body["scaleByChi2"],
        "starts": body["starts"],
        "seed": body["seed"],
        "takeModelSign": body["takeModelSign"],
    }


def warnings_of(result: Mapping[str, Any]) -> List[str]:
    """The verdict's reasons and the notes, one line each: what the command line prints as "warning:" lines."""
    lines = list((result.get("verdict") or {}).get("reasons") or []) + list(result.get("notes") or [])
    return [re.sub(r"\s*[\r\n]+\s*", " ", line).strip() for line in lines]


def with_client_keys(result: JSON, conditions: JSON) -> JSON:
    """The report plus the keys this client adds: warnings, scaledByChi2 and the request's conditions."""
    result["warnings"] = warnings_of(result)
    result["scaledByChi2"] = bool(conditions["scaleByChi2"])
    result["request"] = conditions
    return result


def _finite(value: Any) -> bool:
    return isinstance(value, (int, float)) and not isinstance(value, bool) and math.isfinite(value)


def _profile(result: Mapping[str, Any]) -> JSON:
    ms = (result.get("profile") or {}).get("magneticScale")
    if not ms:
        return {}
    ends = [ms.get("value")] + list(ms.get("interval68") or [None]) + list(ms.get("interval95") or [None])
    if not all(_finite(v) for v in ends):
        return {}  # an interval without finite ends is not stored (the save contract takes two numbers)
    return {"magneticScale": {"value": ms["value"], "interval68": ms["interval68"], "interval95": ms["interval95"]}}


def save_fit_body(fit: Mapping[str, Any], version: int, measurement_sets: List[Mapping[str, Any]],
                  fitted_at: Optional[datetime] = None) -> JSON:
    """The body of POST /api/parameter-sets/{id}/fits for a fit() result: the free keys' values become
    the new version; σ and correlation of the free keys only (the report's values also hold keys
    that carry only a prior and the sets' scale factors, which go in as nuisances); the report's
    findings (each set's χ² and calibration included) and the request's conditions go with them."""
    free: List[str] = [f if isinstance(f, str) else f["key"] for f in fit["free"]]
    names = list(fit["values"].keys())  # the fitted names in the order of the correlation's rows (FitResult.names)
    index = [names.index(k) for k in free]
    conditions = fit.get("request")
    pick = lambda record: {k: record[k] for k in free}  # noqa: E731
    verdict = fit.get("verdict") or {}
    when = fitted_at or datetime.now(timezone.utc)
    summary: JSON = {
        "measurementSets": [{"id": m["id"], "name": m["name"]} for m in measurement_sets],
        "pointCount": len(fit["points"]),
        "free": conditions["free"] if conditions else [{"key": k} for k in free],
        "sigmas": pick(fit["sigmas"]),
        "sigmaScaledByChi2": bool(fit.get("sigmaScaledByChi2", fit.get("scaledByChi2", False))),
        "correlation": [[fit["correlation"][i][j] for j in index] for i in index],
        "chi2": fit["chi2"],
        "dof": fit["dof"],
        "reducedChi2": fit["chi2"] / fit["dof"],
        "separable": bool(verdict.get("separable", False)),
        "fittedAt": when.astimezone(timezone.utc).isoformat(timespec="milliseconds").replace("+00:00", "Z"),
    }
    if fit.get("assumptions") is not None:
        summary["assumptions"] = [{"key": a["key"], "value": a["value"], "source": a["source"]} for a in fit["assumptions"]]
    summary["nuisances"] = [
        {"name": n, "value": fit["values"][n], "sigma": fit["sigmas"].get(n)}
        for n in names
        if n not in free and _finite(fit["values"][n]) and _finite(fit["sigmas"].get(n))
    ]
    if fit.get("comparison"):
        summary["comparison"] = fit["comparison"]
    if fit.get("goodnessOfFit"):
        summary["goodnessOfFit"] = fit["goodnessOfFit"]
    summary["profile"] = _profile(fit)
    if verdict:
        summary["verdict"] = {"separable": bool(verdict.get("separable")), "reasons": list(verdict.get("reasons") or [])}
    if fit.get("notes") is not None:
        summary["notes"] = list(fit["notes"])
    if fit.get("sets"):
        summary["sets"] = fit["sets"]
    if conditions:
        summary["priors"] = conditions["priors"]
        summary["starts"] = conditions["starts"]
        summary["tookModelSign"] = conditions["takeModelSign"]
    return {"version": version, "values": pick(fit["values"]), "fit": summary}


def run_command_line(body: JSON, root: Path, share_intervals: bool) -> JSON:
    """The fit by the repository's command line (`npm run --silent fit`, Node and a checkout needed),
    for fits above the server's synchronous limit. It takes free keys without bounds and sets
    without calibration; anything else is refused here rather than silently dropped."""
    bounded = [f["key"] for f in body["free"] if "min" in f or "max" in f]
    if bounded:
        raise ValueError(f"the fit command line takes no bounds (given for {', '.join(bounded)}); fit through the API or drop them")
    listed = body.get("sets") or [{"name": "data", "points": body["points"], "calibration": body["calibration"]}]
    calibrated = [s["name"] for s in listed if any(v != 0 for v in s["calibration"].values())]
    if calibrated:
        raise ValueError(f"the fit command line takes no calibration (given for {', '.join(calibrated)}); fit through the API")
    names: Dict[str, str] = {}
    with tempfile.TemporaryDirectory(prefix="gyrolux-fit-") as folder:
        p_file = Path(folder, "params.json")
        p_file.write_text(json.dumps(body["params"]), encoding="utf-8")
        args = ["npm", "run", "--silent", "fit", "--", "--params", str(p_file)]
        for i, s in enumerate(listed):
            file_name = f"set-{i + 1}.csv"
            names[file_name] = s["name"]
            Path(folder, file_name).write_text(_csv(s), encoding="utf-8")
            args += ["--data", str(Path(folder, file_name))]
        args += ["--free", ",".join(f["key"] for f in body["free"])]
        for p in body["priors"]:
            args += ["--prior", f"{p['key']}={p['mean']!r}:{p['sigma']!r}"]
        args += ["--starts", str(body["starts"]), "--seed", str(body["seed"])]
        if body["scaleByChi2"]:
            args.append("--scale-by-chi2")
        if body["takeModelSign"]:
            args.append("--magnitudes")
        if not share_intervals:
            args.append("--no-share-intervals")
        run = subprocess.run(args, cwd=root, capture_output=True, text=True)
    if run.returncode != 0:
        raise GyroluxError(0, "fit_failed", (run.stderr or run.stdout).strip() or f"the fit exited with status {run.returncode}")
    result = json.loads(run.stdout)
    if len(listed) == 1:
        names["data"] = listed[0]["name"]  # one data file is fitted as the points of a set named "data"
    for p in result.get("points") or []:
        p["set"] = names.get(p.get("set"), p.get("set"))
    return result


def _csv(fit_set: Mapping[str, Any]) -> str:
    quantities = {p["quantity"] for p in fit_set["points"]}
    if len(quantities) > 1:
        raise ValueError(f'set "{fit_set["name"]}": the command line takes one quantity per file (Verdet constants or rotations)')
    value_column = "rotation_rad" if quantities == {"rotation"} else "verdet_rad_per_T_m"
    rows = [f"wavelength_nm,{value_column},sigma,temperature_K,field_T,length_m"]
    for p in fit_set["points"]:
        rows.append(",".join(repr(float(p[k])) for k in ("wavelengthNm", "value", "sigma", "temperatureK", "fieldT", "lengthM")))
    return "\n".join(rows) + "\n"
