"""Gyrolux from Python: a small client of the Gyrolux REST API (standard library only, Python 3.9+).

    from gyrolux import Client
    gx = Client("http://localhost:3000", token="glx_…")
    sets = gx.parameter_sets()

The API itself is described at /api/openapi.json and on the API page (/api-reference) of the server.
"""

from .client import Client, GyroluxError, RunFailed, default_mapping

__all__ = ["Client", "GyroluxError", "RunFailed", "default_mapping"]
__version__ = "0.1.0"
