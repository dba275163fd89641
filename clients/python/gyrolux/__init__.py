"""Gyrolux from Python: a small client of the Gyrolux REST API (standard library only, Python 3.9+).

    from gyrolux import Client
    gx = Client("http://localhost:3000", token="glx_…")
    sets = gx.parameter_sets()

The API itself is described at /api/openapi.json and on the API page (/api-reference) of the server.
"""

from .client import Client, RunFailed, default_mapping
from .errors import GyroluxError
from .fit import SYNC_FIT_POINT_LIMIT, fit_request, save_fit_body

__all__ = ["Client", "GyroluxError", "RunFailed", "SYNC_FIT_POINT_LIMIT", "default_mapping", "fit_request", "save_fit_body"]
__version__ = "0.2.0"
