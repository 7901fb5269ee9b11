#!/bin/sh
# Makes this machine a Foldwise worker: installs the certificate and the worker unit, opens its silo port,
# and starts it. Run as root:  sudo ./join.sh COORDINATOR_IP[:PORT] /path/to/cluster.pfx
set -eu
if [ "$#" -ne 2 ]; then
    echo "usage: $0 COORDINATOR_IP[:PORT] CLUSTER_PFX" >&2
    exit 2
fi
coordinator=$1
case "$coordinator" in *:*) ;; *) coordinator="$coordinator:11111" ;; esac
pfx=$2
here=$(cd "$(dirname "$0")" && pwd)

[ -f /opt/foldwise/foldwise.dll ] || { echo "install foldwise into /opt/foldwise first (dotnet publish output)" >&2; exit 1; }
id foldwise >/dev/null 2>&1 || useradd --system --home /var/lib/foldwise --create-home --shell /usr/sbin/nologin foldwise

install -d -m 0750 -o root -g foldwise /etc/foldwise
install -m 0640 -o root -g foldwise "$pfx" /etc/foldwise/cluster.pfx
if [ ! -f /etc/foldwise/passphrase.env ]; then
    printf 'Certificate passphrase: ' >&2
    stty -echo; read -r passphrase; stty echo; echo >&2
    umask 077
    printf 'FOLDWISE_CERT_PASSPHRASE=%s\n' "$passphrase" > /etc/foldwise/passphrase.env
    chgrp foldwise /etc/foldwise/passphrase.env && chmod 0640 /etc/foldwise/passphrase.env
fi
install -d -m 0750 -o foldwise -g foldwise /var/cache/foldwise /var/cache/foldwise/tables

sed "s|^Environment=COORDINATOR=.*|Environment=COORDINATOR=$coordinator|" "$here/foldwise-worker.service" > /etc/systemd/system/foldwise-worker.service

# The coordinator connects back to the worker's silo port.
if command -v ufw >/dev/null 2>&1; then
    ufw allow from "${coordinator%:*}" to any port 11113 proto tcp
elif command -v firewall-cmd >/dev/null 2>&1; then
    firewall-cmd --permanent --add-rich-rule="rule family=ipv4 source address=${coordinator%:*} port port=11113 protocol=tcp accept" && firewall-cmd --reload
fi

systemctl daemon-reload
systemctl enable --now foldwise-worker
echo "Worker started; follow it with: journalctl -u foldwise-worker -f"
