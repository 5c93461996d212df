#!/usr/bin/python3
"""Real-client checks of the microtally kernel through jupyter_client.

Starts the kernelspec named on the command line (found through JUPYTER_PATH), then checks
completion, inspection, is_complete, a forged (wrongly signed) execute request, and an in-session
restart. Prints one JSON object with the observations on the last line of stdout; the Java
integration test asserts on it. Exits 0 unless the client itself breaks.
"""
import json
import sys
import time

import zmq
from jupyter_client.manager import KernelManager
from jupyter_client.session import Session

TIMEOUT = 60


def reply_for(kc, msg_id, channel="shell"):
    """The reply to msg_id on the given channel (skipping unrelated ones)."""
    get = kc.get_shell_msg if channel == "shell" else kc.get_control_msg
    end = time.time() + TIMEOUT
    while time.time() < end:
        msg = get(timeout=TIMEOUT)
        if msg["parent_header"].get("msg_id") == msg_id:
            return msg
    raise TimeoutError(msg_id)


def run_cell(kc, code):
    """Executes code; returns (reply content, list of iopub outputs)."""
    outputs = []
    reply = kc.execute_interactive(code, timeout=TIMEOUT, output_hook=lambda m: outputs.append(
        {"type": m["msg_type"], "content": m["content"]}), allow_stdin=False)
    return reply["content"], outputs


def main():
    name = sys.argv[1] if len(sys.argv) > 1 else "microtally"
    out = {}
    km = KernelManager(kernel_name=name)
    t0 = time.perf_counter()
    km.start_kernel()
    kc = km.client()
    kc.start_channels()
    kc.wait_for_ready(timeout=TIMEOUT)
    out["ready_seconds"] = time.perf_counter() - t0
    try:
        info = kc.kernel_info(reply=True, timeout=TIMEOUT)["content"]
        out["language"] = info["language_info"]["name"]
        out["protocol_version"] = info.get("protocol_version")

        content, _ = run_cell(kc, 'String halyardTrap = "4:4:1 at 24 Hz";')
        out["define_status"] = content["status"]

        code = "halyardTrap.len"
        msg_id = kc.complete(code, len(code))
        c = reply_for(kc, msg_id)["content"]
        out["complete_status"] = c["status"]
        out["complete_matches"] = c["matches"]
        out["complete_range"] = [c["cursor_start"], c["cursor_end"]]

        code = "halyardTrap.length()"
        msg_id = kc.inspect(code, len("halyardTrap.len"), detail_level=0)
        i = reply_for(kc, msg_id)["content"]
        out["inspect_found"] = i.get("found", False)
        out["inspect_text"] = i.get("data", {}).get("text/plain", "")

        msg_id = kc.is_complete("for (int i = 0; i < 3; i++) {")
        out["is_complete_open"] = reply_for(kc, msg_id)["content"]["status"]
        msg_id = kc.is_complete("int j = 1;")
        out["is_complete_closed"] = reply_for(kc, msg_id)["content"]["status"]

        # A forged request: right channel, right format, signed with a wrong key.
        forger = Session(key=b"definitely-not-the-key", username="forger")
        forged = forger.msg("execute_request", content={
            "code": "int forgedRan = 1;", "silent": False, "store_history": True,
            "user_expressions": {}, "allow_stdin": False, "stop_on_error": True})
        forger.send(kc.shell_channel.socket, forged)
        time.sleep(1.0)
        answered = False
        while True:
            try:
                m = kc.get_shell_msg(timeout=0.2)
            except Exception:  # queue.Empty
                break
            if m["parent_header"].get("msg_id") == forged["header"]["msg_id"]:
                answered = True
        out["forged_answered"] = answered
        content, _ = run_cell(kc, "forgedRan")
        out["forged_probe_status"] = content["status"]
        out["forged_probe_ename"] = content.get("ename", "")

        t1 = time.perf_counter()
        km.restart_kernel(now=False)
        kc.wait_for_ready(timeout=TIMEOUT)
        out["restart_seconds"] = time.perf_counter() - t1
        content, _ = run_cell(kc, "halyardTrap")
        out["after_restart_status"] = content["status"]
        content, outputs = run_cell(kc, "6 * 7")
        out["after_restart_value"] = [o["content"]["data"]["text/plain"] for o in outputs if o["type"] == "execute_result"]
    finally:
        kc.stop_channels()
        km.shutdown_kernel(now=False)
        out["shutdown_clean"] = not km.is_alive()
    print(json.dumps(out))


if __name__ == "__main__":
    main()
