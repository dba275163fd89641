"""The client's error: a refused request, or a fit the command line could not run."""

from typing import Any, Dict, Optional


class GyroluxError(Exception):
    """A refused request: the HTTP status and the API's error code, message and per-field messages."""

    def __init__(self, status: int, code: str, message: str, fields: Optional[Dict[str, str]] = None, body: Any = None):
        super().__init__(f"{status} {code}: {message}" + (f" {fields}" if fields else ""))
        self.status = status
        self.code = code
        self.message = message
        self.fields = fields or {}
        self.body = body
