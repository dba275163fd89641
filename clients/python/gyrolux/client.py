"""The client: one class over urllib, JSON in and out, errors as GyroluxError.

Units are the API's: SI unless a name says otherwise (wavelengthNm, fieldT, temperatureK); the
points of a measurement set come back in rad/(T·m) (Verdet constants) or rad (rotations).
"""

import json
import os
import time
import uuid
from pathlib import Path
from typing import Any, Dict, Iterable, List, Mapping, Optional, Sequence, Union
from urllib.error import HTTPError, URLError
from urllib.parse import quote, urlencode
from urllib.request import Request, urlopen

from .errors import GyroluxError
from .fit import SYNC_FIT_POINT_LIMIT, PriorsArg, fit_request, request_conditions, run_command_line, save_fit_body, with_client_keys

try:  # numpy is optional: arrays when it is installed, lists always.
    import numpy as _np
except ImportError:  # pragma: no cover - depends on the machine
    _np = None

JSON = Dict[str, Any]

# The column names the upload maps by itself (lib/measurements/parse.ts DEFAULT_COLUMNS).
DEFAULT_COLUMNS = {
    "wavelength": "wavelength_nm",
    "verdet": "verdet_rad_per_T_m",
    "rotation": "rotation_rad",
    "sigma": "sigma",
    "temperature": "temperature_K",
    "field": "field_T",
    "length": "length_m",
}

ACTIVE_STATES = ("queued", "running")


class RunFailed(Exception):
    """A lab run that ended failed or cancelled; `run` is its last state."""

    def __init__(self, run: JSON):
        super().__init__(f"lab run {run.get('id')} ended {run.get('state')}: {run.get('error') or 'no message'}")
        self.run = run


def _header_cells(text: str) -> List[str]:
    """The header of a measurement file as the server reads it, for the default mapping."""
    lines = [line for line in text.splitlines() if line.strip()]
    data = [line for line in lines if not line.lstrip().startswith("#")]
    if not data:
        return []
    first = data[0]

    def split(line: str) -> List[str]:
        for sep in ("\t", ";", ","):
            if sep in line:
                return [c.strip() for c in line.split(sep)]
        return line.split()

    cells = split(first)
    numeric = any(_is_number(c) for c in cells)
    comments = [line for line in lines[: lines.index(first)] if line.lstrip().startswith("#")]
    if numeric and comments:  # numpy.savetxt's "# a b c" header
        return split(comments[-1].lstrip()[1:].strip())
    return cells


def _is_number(text: str) -> bool:
    try:
        float(text.replace(",", "."))
        return True
    except ValueError:
        return False


def default_mapping(headers: Iterable[str]) -> JSON:
    """The column mapping for files with the default column names; a column the file lacks is None."""
    names = set(headers)
    pick = lambda key: DEFAULT_COLUMNS[key] if DEFAULT_COLUMNS[key] in names else None  # noqa: E731
    rotation = pick("verdet") is None and pick("rotation") is not None
    return {
        "wavelengthColumn": pick("wavelength"),
        "wavelengthUnit": "nm",
        "quantity": "rotation" if rotation else "verdet",
        "valueColumn": pick("rotation") if rotation else pick("verdet"),
        "valueUnit": "rad" if rotation else "rad/(T·m)",
        "sigmaColumn": pick("sigma"),
        "temperatureColumn": pick("temperature"),
        "fieldColumn": pick("field"),
        "lengthColumn": pick("length"),
    }


def _multipart(fields: Dict[str, str], file_field: str, file_name: str, data: bytes, content_type: str):
    boundary = f"gyrolux-{uuid.uuid4().hex}"
    parts: List[bytes] = []
    for name, value in fields.items():
        parts.append(f'--{boundary}\r\nContent-Disposition: form-data; name="{name}"\r\n\r\n{value}\r\n'.encode("utf-8"))
    safe_name = file_name.replace('"', "_").replace("\r", "_").replace("\n", "_")
    parts.append(
        f'--{boundary}\r\nContent-Disposition: form-data; name="{file_field}"; filename="{safe_name}"\r\n'
        f"Content-Type: {content_type}\r\n\r\n".encode("utf-8")
    )
    parts.append(data)
    parts.append(f"\r\n--{boundary}--\r\n".encode("utf-8"))
    return b"".join(parts), f"multipart/form-data; boundary={boundary}"


class Client:
    """A Gyrolux server and an API token (make one in Settings → API tokens)."""

    def __init__(self, base_url: str, token: str, timeout: float = 60.0):
        self.base_url = base_url.rstrip("/")
        self.token = token
        self.timeout = timeout

    # ---- HTTP ----

    def request(self, method: str, path: str, json_body: Any = None, query: Optional[JSON] = None,
                body: Optional[bytes] = None, content_type: Optional[str] = None, timeout: Optional[float] = None) -> Any:
        """One API call; the parsed JSON answer (None for 204). Raises GyroluxError on an error answer."""
        url = self.base_url + path
        clean = {k: v for k, v in (query or {}).items() if v is not None}
        if clean:
            url += "?" + urlencode(clean)
        headers = {"Authorization": f"Bearer {self.token}", "Accept": "application/json"}
        if json_body is not None:
            body = json.dumps(json_body).encode("utf-8")
            content_type = "application/json"
        if content_type:
            headers["Content-Type"] = content_type
        req = Request(url, data=body, method=method, headers=headers)
        try:
            with urlopen(req, timeout=timeout or self.timeout) as response:
                raw = response.read()
                if response.status == 204 or not raw:
                    return None
                if "json" in (response.headers.get("Content-Type") or ""):
                    return json.loads(raw.decode("utf-8"))
                return raw
        except HTTPError as error:
            raw = error.read()
            try:
                parsed = json.loads(raw.decode("utf-8"))
                err = parsed.get("error", {})
                raise GyroluxError(error.code, err.get("code", "unknown"), err.get("message", ""), err.get("fields"), parsed) from None
            except (ValueError, AttributeError):
                raise GyroluxError(error.code, "unknown", raw.decode("utf-8", "replace")[:200]) from None
        except URLError as error:
            raise GyroluxError(0, "network", f"cannot reach {self.base_url}: {error.reason}") from None

    def _pages(self, path: str, query: Optional[JSON] = None) -> List[JSON]:
        """Every item of a paged list (follows nextCursor)."""
        items: List[JSON] = []
        cursor = None
        while True:
            page = self.request("GET", path, query={**(query or {}), "limit": 200, "cursor": cursor})
            items.extend(page["items"])
            cursor = page.get("nextCursor")
            if not cursor:
                return items

    # ---- labs and parameter sets ----

    def labs(self) -> List[JSON]:
        """Your labs, each with your role in it."""
        return self.request("GET", "/api/labs")["items"]

    def parameter_sets(self, lab_id: Optional[str] = None, q: Optional[str] = None, tag: Optional[str] = None) -> List[JSON]:
        return self._pages("/api/parameter-sets", {"labId": lab_id, "q": q, "tag": tag})

    def parameter_set(self, set_id: str) -> JSON:
        """One set with its current parameters (`params`) and `version`."""
        return self.request("GET", f"/api/parameter-sets/{quote(set_id)}")["item"]

    def versions(self, set_id: str) -> List[JSON]:
        """Every version of a set, newest first, each with its params and provenance."""
        return self._pages(f"/api/parameter-sets/{quote(set_id)}/versions")

    # ---- measurements ----

    def measurement_sets(self, lab_id: Optional[str] = None, q: Optional[str] = None) -> List[JSON]:
        """Measurement sets you can see (every page), each with its id, name and counts."""
        return self._pages("/api/measurement-sets", {"labId": lab_id, "q": q})

    def points(self, set_id: str, include_masked: bool = False, arrays: bool = False) -> Union[List[JSON], JSON]:
        """The points in SI. Masked points are left out unless include_masked (as fits and overlays do).

        arrays=True answers columns instead of rows: {"wavelengthNm": array, "value": …, "sigma": …,
        "temperatureK": …, "fieldT": …, "lengthM": …} as numpy arrays (numpy required).
        """
        rows = self.request("GET", f"/api/measurement-sets/{quote(set_id)}/points")["points"]
        if not include_masked:
            rows = [p for p in rows if not p.get("masked")]
        if not arrays:
            return rows
        keys = ("wavelengthNm", "value", "sigma", "temperatureK", "fieldT", "lengthM")
        return {key: _array([p[key] for p in rows]) for key in keys}

    def upload_measurements(self, lab_id: str, name: str, file: Union[str, os.PathLike, bytes], *, file_name: Optional[str] = None,
                            mapping: Optional[JSON] = None, defaults: Optional[JSON] = None, sample: str = "",
                            delimiter: str = "auto", decimal: str = "auto") -> JSON:
        """Uploads a measurement file (CSV, TSV, semicolons with decimal commas, numpy.savetxt output) as a new set.

        mapping defaults to the default column names (wavelength_nm, verdet_rad_per_T_m or rotation_rad,
        sigma, temperature_K, field_T, length_m); defaults gives whole-file values such as
        {"temperatureK": 293.15, "fieldT": 1, "lengthM": 0.01, "relativeSigma": 0.02}.
        A file with bad rows raises GyroluxError whose body["error"]["problems"] names each line.
        """
        if isinstance(file, bytes):
            data, fname = file, file_name or "measurements.csv"
        else:
            data, fname = Path(file).read_bytes(), file_name or Path(file).name
        if mapping is None:
            mapping = default_mapping(_header_cells(data.decode("utf-8", "replace")))
        form = {
            "labId": lab_id,
            "name": name,
            "sample": sample,
            "mapping": json.dumps(mapping),
            "defaults": json.dumps(defaults or {}),
            "format": json.dumps({"delimiter": delimiter, "decimal": decimal}),
        }
        body, content_type = _multipart(form, "file", fname, data, "text/csv")
        return self.request("POST", "/api/measurement-sets", body=body, content_type=content_type)["item"]

    # ---- fits ----

    def fit(self, params: JSON, points: Optional[List[JSON]] = None, free: Optional[Sequence[Union[str, JSON]]] = None,
            scale_by_chi2: bool = False, repo: Optional[Union[str, os.PathLike]] = None, *, priors: PriorsArg = None,
            sets: Optional[Sequence[Mapping[str, Any]]] = None, calibration: Optional[Mapping[str, Any]] = None,
            starts: int = 4, seed: int = 1, magnitudes: bool = False, share_intervals: bool = False,
            local: bool = False, timeout: Optional[float] = None) -> JSON:
        """Fits the model to measured points on the server (POST /api/compute/fit) and answers its report.

        The server fits the free parameters by weighted least squares from `starts` seeded starts,
        and reports σ and correlation, χ² and its p-value, the comparison with magneticScale held at
        0 and at 1 (when magneticScale is free), the profile-likelihood interval of magneticScale, the
        held values with their sources, and a verdict on whether the electric- and magnetic-dipole
        parts are separated in this model, with its reasons. It fits up to 500 points
        (SYNC_FIT_POINT_LIMIT); above that it answers 413, raised here as a GyroluxError naming the
        fallback: local=True (or repo=the checkout) runs the repository's fit command line
        (`npm run --silent fit`, Node needed), which takes no bounds and no calibration.

        params: a parameter set's params (parameter_set(id)["params"]).
        points: one measurement set's points as points() answers them (masked ones left out), or
            dicts with wavelengthNm, value, sigma and optionally line, quantity ("verdet" in
            rad/(T·m) or "rotation" in rad), temperatureK, fieldT, lengthM (else the params' value).
        sets: instead of points, several measurement sets fitted together with shared parameters:
            [{"name", "points", "calibration"?, "id"?}]; calibration {"scaleSigma", "temperatureSigmaK",
            "relativeFloor"} makes that set's field × length scale, temperature and error floor
            nuisances; "id" (a measurement set's) lets save_fit name the sets by itself.
        calibration: the calibration of `points`.
        free: keys or {"key", "min"?, "max"?} (default gyrationPerT, oscillatorWavelengthNm, magneticScale).
        priors: Gaussian priors, {key: (mean, sigma)} or [{"key", "mean", "sigma"}]; a key with a prior
            that is not free is fitted as a nuisance.
        magnitudes: the values are magnitudes; each takes the sign of the model at the starting values.
        scale_by_chi2: σ multiplied by √(χ²/dof) when that exceeds 1 (refused below 3 degrees of freedom).
        share_intervals: also profile the magnetic share at every distinct point condition (slower).

        Answers the report as the fit command line prints it (free, values, sigmas, correlation over
        the names of values in their order, chi2, dof, converged, notes, assumptions, comparison,
        informationCriteria, goodnessOfFit, profile, verdict, points, shareCovariance), plus
        "warnings" (the verdict's reasons and the notes, one line each), "scaledByChi2", "request"
        (the request without its points, for save_fit) and, from the server, "engineVersion" and "computeMs".
        """
        body = fit_request(params, points, free=free, priors=priors, sets=sets, calibration=calibration, starts=starts,
                           seed=seed, magnitudes=magnitudes, scale_by_chi2=scale_by_chi2)
        conditions = request_conditions(body, sets)
        if local or repo is not None:
            root = Path(repo) if repo else Path(__file__).resolve().parents[3]
            return with_client_keys(run_command_line(body, root, share_intervals), conditions)
        query = {"shareIntervals": "true"} if share_intervals else None
        try:
            answer = self.request("POST", "/api/compute/fit", json_body=body, query=query, timeout=timeout)
        except GyroluxError as error:
            if error.status != 413:
                raise
            raise GyroluxError(
                413,
                error.code,
                f"{error.message} The server fits up to {SYNC_FIT_POINT_LIMIT} points at once; fit this one on this machine with "
                "fit(..., local=True), which runs the repository's fit command line (npm run fit; needs Node and a checkout).",
                error.fields,
                error.body,
            ) from None
        result = with_client_keys(answer["result"], conditions)
        result["engineVersion"] = answer.get("engineVersion")
        result["computeMs"] = answer.get("computeMs")
        return result

    def save_fit(self, set_id: str, fit: JSON, measurement_sets: Optional[List[JSON]] = None, version: Optional[int] = None) -> JSON:
        """Saves a fit() result as a new version of the set, with the fit's report as its provenance.

        The version takes the free parameters' values; σ and correlation are stored for those keys
        only, keys fitted through a prior alone and the sets' scale factors as nuisances, beside the
        held values, priors, each set's χ² and calibration, comparison, goodness of fit, profile
        interval, verdict, notes, starts and whether the model's sign was taken.
        measurement_sets: the sets the points came from, as measurement_sets() lists them (id and
        name); by default the sets given to fit() when each carried its "id".
        version: the version the fit started from (default: the set's current version; a newer one answers 409).
        """
        if measurement_sets is None:
            listed = (fit.get("request") or {}).get("sets") or []
            if not listed or not all(s.get("id") for s in listed):
                raise ValueError("name the measurement sets the fit used: save_fit(set_id, fit, [measurement set, …])")
            measurement_sets = [{"id": s["id"], "name": s["name"]} for s in listed]
        if version is None:
            version = self.parameter_set(set_id)["version"]
        body = save_fit_body(fit, version, measurement_sets)
        return self.request("POST", f"/api/parameter-sets/{quote(set_id)}/fits", json_body=body)["item"]

    # ---- lab runs ----

    def submit_run(self, lab_id: str, kind: str, payload: JSON, parameter_set_id: Optional[str] = None) -> JSON:
        """Queues a lab run: kind "map" or "spectrum" with its payload (see POST /api/runs on the API page)."""
        body: JSON = {"labId": lab_id, "kind": kind, "payload": payload}
        if parameter_set_id:
            body["parameterSetId"] = parameter_set_id
        return self.request("POST", "/api/runs", json_body=body)["item"]

    def run(self, run_id: str) -> JSON:
        return self.request("GET", f"/api/runs/{quote(run_id)}")["item"]

    def cancel_run(self, run_id: str) -> JSON:
        return self.request("POST", f"/api/runs/{quote(run_id)}/cancel")["item"]

    def wait(self, run_id: str, timeout: float = 600.0, poll: float = 1.0) -> JSON:
        """Polls until the run is done; raises RunFailed if it failed or was cancelled, TimeoutError after timeout."""
        deadline = time.monotonic() + timeout
        while True:
            run = self.run(run_id)
            if run["state"] == "done":
                return run
            if run["state"] not in ACTIVE_STATES:
                raise RunFailed(run)
            if time.monotonic() > deadline:
                raise TimeoutError(f"lab run {run_id} still {run['state']} after {timeout:.0f} s ({run['progress']:.0%})")
            time.sleep(poll)

    def result(self, run_id: str, arrays: bool = False) -> JSON:
        """A finished run's result: meta and columns as lists (None where NaN), or numpy arrays (NaN) with arrays=True."""
        body = self.request("GET", f"/api/runs/{quote(run_id)}/result")
        if arrays:
            body["columns"] = {k: _array([float("nan") if v is None else v for v in col]) for k, col in body["columns"].items()}
        return body

    def run_and_wait(self, lab_id: str, kind: str, payload: JSON, timeout: float = 600.0, arrays: bool = False, **kw: Any) -> JSON:
        """submit_run, wait and result in one call."""
        run = self.submit_run(lab_id, kind, payload, **kw)
        self.wait(run["id"], timeout=timeout)
        return self.result(run["id"], arrays=arrays)


def _array(values: List[Any]):
    if _np is None:
        raise ImportError("arrays=True needs numpy (pip install numpy); without it, call with arrays=False for lists")
    return _np.asarray(values, dtype=float)
