/**
 * The configuration files of the local Swift (dev-services/s3.ts): one private folder holds them with
 * the rings and the data, and its servers start through serveScript, so /etc/swift is never read. One device, one replica, no replicators or
 * auditors: the smallest Swift that speaks S3 and checks its signatures.
 */
export interface SwiftPorts {
  proxy: number;
  account: number;
  container: number;
  object: number;
  memcached: number;
}

export const storageServers = ["account", "container", "object"] as const;
export type StorageServer = (typeof storageServers)[number];

export interface SwiftSettings {
  dir: string;
  ports: SwiftPorts;
  /** The Debian user the servers run as (they drop to it when started as root). */
  user: string;
  hashSuffix: string;
  /** tempauth's account, user and key: the S3 access key id is `account:user`. */
  account: string;
  userName: string;
  key: string;
  /** Pages that may PUT parts and read the ETag header (CORS, set for the whole proxy). */
  origins: string[];
}

const common = (s: SwiftSettings, port: number) => `[DEFAULT]
bind_ip = 127.0.0.1
bind_port = ${port}
# A port taken after it was checked: fail in seconds, not the default half minute.
bind_timeout = 5
workers = 0
user = ${s.user}
swift_dir = ${s.dir}
devices = ${s.dir}/devices
mount_check = false
log_level = WARNING
`;

/**
 * Starts one server the way swift-<server>-server does, but with the folder's swift.conf: Swift's
 * scripts read /etc/swift/swift.conf (hash suffix, storage policies, constraints) whatever
 * `swift_dir` says. Run as `python3 serve.py <folder> <server> <server>.conf -v`.
 */
export const serveScript = `import sys
from swift.common import utils
utils.SWIFT_CONF_FILE = sys.argv[1] + "/swift.conf"
from swift.common import constraints, storage_policy
constraints.reload_constraints()
storage_policy.reload_storage_policies()
from swift.common.wsgi import run_wsgi
server = sys.argv[2]
sys.argv = [f"swift-{server}-server"] + sys.argv[3:]
conf_file, options = utils.parse_options()
if server == "object":
    from swift.obj.server import global_conf_callback
    options["global_conf_callback"] = global_conf_callback
sys.exit(run_wsgi(conf_file, f"{server}-server", **options))
`;

export function swiftConf(s: SwiftSettings): string {
  return `[swift-hash]
swift_hash_path_suffix = ${s.hashSuffix}

[storage-policy:0]
name = only
default = yes

[swift-constraints]
# S3 allows 10,000 parts; Swift's own listing limit must hold them.
container_listing_limit = 10000
`;
}

export function storageServerConf(s: SwiftSettings, server: StorageServer): string {
  return `${common(s, s.ports[server])}
[pipeline:main]
pipeline = healthcheck ${server}-server

[app:${server}-server]
use = egg:swift#${server}

[filter:healthcheck]
use = egg:swift#healthcheck
`;
}

/** Middleware of the proxy's pipeline that needs no setting of ours. */
const plainFilters = ["catch_errors", "gatekeeper", "healthcheck", "proxy-logging", "listing_formats", "bulk", "copy", "dlo"];

export function proxyConf(s: SwiftSettings): string {
  const origins = s.origins.join(",");
  return `${common(s, s.ports.proxy)}cors_allow_origin = ${origins}
cors_expose_headers = ETag
strict_cors_mode = true

[pipeline:main]
pipeline = catch_errors gatekeeper healthcheck proxy-logging cache listing_formats bulk s3api tempauth copy slo dlo proxy-logging proxy-server

[app:proxy-server]
use = egg:swift#proxy
account_autocreate = true

[filter:s3api]
use = egg:swift#s3api
location = us-east-1
max_upload_part_num = 10000
# Browsers ask before a PUT to a presigned URL; the answer must name these pages.
cors_preflight_allow_origin = ${origins}

[filter:tempauth]
use = egg:swift#tempauth
user_${s.account}_${s.userName} = ${s.key} .admin

[filter:cache]
use = egg:swift#memcache
memcache_servers = 127.0.0.1:${s.ports.memcached}

[filter:slo]
use = egg:swift#slo
max_manifest_segments = 10000

${plainFilters.map((name) => `[filter:${name}]\nuse = egg:swift#${name.replaceAll("-", "_")}\n`).join("\n")}`;
}
