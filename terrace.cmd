@echo off
rem Terrace launcher for Windows: builds the command-line jar when it is missing or older than the
rem sources, then runs it with all arguments. Works from any current directory. Same behaviour as
rem the POSIX launcher ./terrace beside this file.
setlocal EnableExtensions DisableDelayedExpansion
set "here=%~dp0"
if "%here:~-1%"=="\" set "here=%here:~0,-1%"
set "jar=%here%\cli\target\cli-0.1.0-SNAPSHOT-all.jar"

where java >nul 2>nul
if errorlevel 1 goto no_java

if not exist "%jar%" goto build
rem any source, resource or pom newer than the jar triggers a rebuild (checked with PowerShell,
rem which every supported Windows has; without it only a missing jar triggers a build)
where powershell >nul 2>nul
if errorlevel 1 goto run
powershell -NoProfile -ExecutionPolicy Bypass -Command ^
  "$j=(Get-Item -LiteralPath $env:jar).LastWriteTimeUtc;" ^
  "$r=@('pom.xml','optimizer-core','model-plugins','datasets-demo','cli') | ForEach-Object { Join-Path $env:here $_ };" ^
  "$n=Get-ChildItem -LiteralPath $r -Recurse -File -ErrorAction SilentlyContinue | Where-Object {" ^
  "  $_.FullName -notmatch '[\\/]target[\\/]' -and ($_.Name -like '*.java' -or $_.Name -eq 'pom.xml' -or $_.FullName -match '[\\/]src[\\/]main[\\/]resources[\\/]')" ^
  "} | Where-Object { $_.LastWriteTimeUtc -gt $j } | Select-Object -First 1;" ^
  "if ($n) { exit 1 } else { exit 0 }"
if errorlevel 1 goto build
goto run

:build
where mvn >nul 2>nul
if errorlevel 1 goto no_mvn
echo terrace: building (mvn -q -B -DskipTests package) ... 1>&2
pushd "%here%"
call mvn -q -B -DskipTests package 1>&2
set "build_rc=%errorlevel%"
popd
if not "%build_rc%"=="0" goto build_failed

:run
rem one BLAS thread per Java worker: Terrace already fits its surrogates on both cores
if not defined OPENBLAS_NUM_THREADS set "OPENBLAS_NUM_THREADS=1"
rem the C1 compiler alone starts faster for these short, compute-heavy commands (DEVELOPERS.md, speed)
if not defined TERRACE_JAVA_OPTS set "TERRACE_JAVA_OPTS=-XX:TieredStopAtLevel=1"
java %TERRACE_JAVA_OPTS% -Dorg.slf4j.simpleLogger.defaultLogLevel=error -Djava.awt.headless=true -jar "%jar%" %*
exit /b %errorlevel%

:no_java
echo terrace: 'java' was not found on PATH; install a JDK 17 or newer 1>&2
exit /b 2

:no_mvn
echo terrace: the jar needs building but 'mvn' was not found on PATH; install Apache Maven 3.8 or newer 1>&2
exit /b 2

:build_failed
echo terrace: the build failed; see the Maven output above 1>&2
exit /b 1
