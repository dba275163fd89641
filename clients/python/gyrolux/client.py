"""The client: one class over urllib, JSON in and out, errors as GyroluxError.

Units are the API's: SI unless a name says otherwise (wavelengthNm, fieldT, temperatureK); the
points of a measurement set come back in rad/(T·m) (Verdet constants) or rad (rotations).
"""

import json
import os
import subprocess
import tempfile
import time
import uuid
from datetime import datetime, timezone
from pathlib import Path
from typing import Any, Dict, Iterable, List, Optional, Union
from urllib.error import HTTPError, URLError
from urllib.parse import quote, urlencode
from urllib.request import Request, urlopen

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

# What the fit command line prints as warnings that are not about separating the two parts
# (lib/fit/cli-input.ts): a parameter on a bound, a fit stopped at its iteration limit.
_NOT_SEPARATION = ("ended on a bound", "stopped at its iteration limit")

ACTIVE_STATES = ("queued", "running")


class GyroluxError(Exception):
    """A refused request: the HTTP status and the API's error code, message and per-field messages."""

    def __init__(self, status: int, code: str, message: str, fields: Optional[Dict[str, str]] = None, body: Any = None):
        super().__init__(f"{status} {code}: {message}" + (f" {fields}" if fields else ""))
        self.status = status
        self.code = code
        self.message = message
        self.fields = fields or {}
        self.body = body


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
                body: Optional[bytes] = None, content_type: Optional[str] = None) -> Any:
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
            with urlopen(req, timeout=self.timeout) as response:
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
        return self.request("GET", "/api/measurement-sets", query={"labId": lab_id, "q": q})["items"]

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

    def fit(self, params: JSON, points: List[JSON], free: Optional[List[str]] = None, scale_by_chi2: bool = False,
            repo: Optional[Union[str, os.PathLike]] = None) -> JSON:
        """Fits the model to points with the product's own fit command line (`npm run --silent fit`).

        The server has no fit endpoint: fits run in the browser (the workbench's fit panel) or with
        that command line, which needs Node and a checkout of the repository (`repo`, by default the
        one this client lives in). Answers the command's JSON (free, values, sigmas, correlation,
        chi2, dof, points) plus "warnings" (its stderr notes). Masked points should be left out
        (points() does so by default).
        """
        root = Path(repo) if repo else Path(__file__).resolve().parents[3]
        parameter_keys = {k: v for k, v in params.items() if k not in ("wavelengthsNm",)}
        with tempfile.TemporaryDirectory(prefix="gyrolux-fit-") as folder:
            p_file = Path(folder, "params.json")
            d_file = Path(folder, "data.csv")
            p_file.write_text(json.dumps(parameter_keys), encoding="utf-8")
            verdet = all(p.get("quantity", "verdet") == "verdet" for p in points)
            value_column = "verdet_rad_per_T_m" if verdet else "rotation_rad"
            rows = ["wavelength_nm,%s,sigma,temperature_K,field_T,length_m" % value_column]
            for p in points:
                rows.append(",".join(repr(float(p[k])) for k in ("wavelengthNm", "value", "sigma", "temperatureK", "fieldT", "lengthM")))
            d_file.write_text("\n".join(rows) + "\n", encoding="utf-8")
            args = ["npm", "run", "--silent", "fit", "--", "--params", str(p_file), "--data", str(d_file)]
            if free:
                args += ["--free", ",".join(free)]
            if scale_by_chi2:
                args.append("--scale-by-chi2")
            run = subprocess.run(args, cwd=root, capture_output=True, text=True)
        if run.returncode != 0:
            raise GyroluxError(0, "fit_failed", (run.stderr or run.stdout).strip() or f"the fit exited with status {run.returncode}")
        result = json.loads(run.stdout)
        result["warnings"] = [line[len("warning: "):] for line in run.stderr.splitlines() if line.startswith("warning: ")]
        result["scaledByChi2"] = scale_by_chi2
        return result

    def save_fit(self, set_id: str, fit: JSON, measurement_sets: List[JSON], version: Optional[int] = None) -> JSON:
        """Saves a fit() result as a new version of the set, with the fit as its provenance.

        measurement_sets: the sets the points came from, as measurement_sets() lists them (id and name).
        version: the version the fit started from (default: the set's current version).
        """
        if version is None:
            version = self.parameter_set(set_id)["version"]
        keys = [f if isinstance(f, str) else f["key"] for f in fit["free"]]
        separable = not any(not any(mark in w for mark in _NOT_SEPARATION) for w in fit.get("warnings", []))
        body = {
            "version": version,
            "values": {k: fit["values"][k] for k in keys},
            "fit": {
                "measurementSets": [{"id": m["id"], "name": m["name"]} for m in measurement_sets],
                "pointCount": len(fit["points"]),
                "free": [{"key": k} for k in keys],
                "sigmas": {k: fit["sigmas"][k] for k in keys},
                "sigmaScaledByChi2": bool(fit.get("scaledByChi2", False)),
                "correlation": fit["correlation"],
                "chi2": fit["chi2"],
                "dof": fit["dof"],
                "reducedChi2": fit["chi2"] / fit["dof"],
                "separable": separable,
                "fittedAt": datetime.now(timezone.utc).isoformat().replace("+00:00", "Z"),
            },
        }
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
